/**
 * The layer rules of the workspace (DEVELOPERS.md, "Layers") are enforced by ESLint.
 * These checks lint small snippets as if they lived in each project, so a change to
 * eslint.config.mjs that silently drops a rule makes this test fail.
 */
import { spawn } from 'node:child_process';
import * as path from 'node:path';

const root = path.resolve(__dirname, '../../../..');
const eslintBin = path.join(root, 'node_modules/eslint/bin/eslint.js');

interface LintResult {
  messages: { ruleId: string | null; message: string }[];
}

/** Lints `code` through the ESLint command line as if it were the file `filePath`. */
function restrictedImportErrors(filePath: string, code: string): Promise<string[]> {
  return new Promise((resolve, reject) => {
    const child = spawn(
      process.execPath,
      [eslintBin, '--format', 'json', '--stdin', '--stdin-filename', path.join(root, filePath)],
      { cwd: root },
    );
    let stdout = '';
    let stderr = '';
    child.stdout.on('data', (chunk: Buffer) => (stdout += chunk.toString()));
    child.stderr.on('data', (chunk: Buffer) => (stderr += chunk.toString()));
    child.on('error', reject);
    child.on('close', () => {
      try {
        const [result] = JSON.parse(stdout) as LintResult[];
        resolve(result.messages.filter((m) => m.ruleId === 'no-restricted-imports').map((m) => m.message));
      } catch {
        reject(new Error(`ESLint gave no JSON result: ${stderr || stdout}`));
      }
    });
    child.stdin.end(code);
  });
}

const importOf = (spec: string) => `import * as m from '${spec}';\nexport const x = m;\n`;

describe('layer rules', () => {
  jest.setTimeout(60000);

  it.each([
    ['libs/contracts/src/lib/probe.ts', '@rotaplex/roster-model'],
    ['libs/contracts/src/lib/probe.ts', '@nestjs/common'],
    ['libs/roster-model/src/lib/probe.ts', '@nestjs/common'],
    ['libs/roster-model/src/lib/probe.ts', 'typeorm'],
    ['libs/roster-model/src/lib/probe.ts', 'react'],
    ['apps/web/src/probe.ts', '@rotaplex/roster-model'],
    ['apps/web/src/probe.ts', '@nestjs/core'],
    ['apps/api/src/probe.ts', 'react'],
    ['apps/api/src/probe.ts', '../../../libs/contracts/src/index'],
  ])('%s may not import %s', async (file, spec) => {
    expect(await restrictedImportErrors(file, importOf(spec))).not.toHaveLength(0);
  });

  it.each([
    ['libs/roster-model/src/lib/probe.ts', '@rotaplex/contracts'],
    ['apps/web/src/probe.ts', '@rotaplex/contracts'],
    ['apps/api/src/probe.ts', '@rotaplex/contracts'],
    ['apps/api/src/probe.ts', '@rotaplex/roster-model'],
  ])('%s may import %s', async (file, spec) => {
    expect(await restrictedImportErrors(file, importOf(spec))).toHaveLength(0);
  });
});
