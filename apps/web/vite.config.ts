import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vite';
import react from '@vitejs/plugin-react';

const here = fileURLToPath(new URL('.', import.meta.url));
const fromHere = (p: string) => fileURLToPath(new URL(p, import.meta.url));

// React gets a long-lived chunk of its own. Everything else is split by route (lazy pages and
// views): FullCalendar and recharts then load only with the calendar and reports screens. Groups
// for them pulled shared modules in and made the sign-in page preload them (measured with
// `npm run bench:bundle`; see docs/benchmarks.md).
const CHUNK_GROUPS: { name: string; test: RegExp }[] = [
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
        codeSplitting: { groups: CHUNK_GROUPS },
      },
    },
  },
});
