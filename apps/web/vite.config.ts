import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vite';
import react from '@vitejs/plugin-react';

const here = fileURLToPath(new URL('.', import.meta.url));
const fromHere = (p: string) => fileURLToPath(new URL(p, import.meta.url));

// Heavy view libraries get chunks of their own so the shell stays small and they load with their route.
const CHUNK_GROUPS: { name: string; test: RegExp }[] = [
  { name: 'calendar', test: /node_modules[\\/]@fullcalendar[\\/]/ },
  { name: 'charts', test: /node_modules[\\/](recharts|d3-[a-z]+|victory-vendor)[\\/]/ },
  { name: 'react', test: /node_modules[\\/](react|react-dom|react-router|react-router-dom|scheduler)[\\/]/ },
];

export default defineConfig({
  root: here,
  plugins: [react()],
  resolve: {
    alias: {
      '@rotaplex/contracts': fromHere('../../libs/contracts/src/index.ts'),
      // The app's own root, so deep feature files need no ../../../ chains.
      '@/': fromHere('./src/'),
    },
  },
  server: {
    port: 4200,
    proxy: {
      '/api': { target: 'http://localhost:3000', changeOrigin: false },
    },
  },
  preview: { port: 4300 },
  build: {
    outDir: fromHere('../../dist/web'),
    emptyOutDir: true,
    sourcemap: true,
    chunkSizeWarningLimit: 900,
    rolldownOptions: {
      output: {
        // `manualChunks` is deprecated in Vite 8 (Rolldown); `codeSplitting.groups` is its replacement.
        codeSplitting: { includeDependenciesRecursively: false, groups: CHUNK_GROUPS },
      },
    },
  },
});
