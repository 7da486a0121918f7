// The web app's lint rules (eslint.config.js), run through ESLint's API on snippets placed at
// paths inside the app: features do not import each other (by alias or by a relative path), and
// query keys start from rootKeys in lib/query-keys.ts.
import { fileURLToPath } from 'node:url';
import { ESLint } from 'eslint';
import { beforeAll, describe, expect, it } from 'vitest';

const root = fileURLToPath(new URL('../..', import.meta.url));
let eslint: ESLint;
beforeAll(() => {
  eslint = new ESLint({ cwd: root });
});

/** The messages of one rule for `code` as if it were the file at `path` (from the repository root). */
async function problems(path: string, code: string, rule: string): Promise<string[]> {
  const [result] = await eslint.lintText(code, { filePath: `${root}/${path}` });
  return result!.messages.filter((m) => m.ruleId === rule).map((m) => m.message);
}

const importOf = (from: string) => `import { x } from '${from}';\nexport const y = x;\n`;
/** The import-rule messages, without ESLint's "'…' import is restricted from being used by a pattern." prefix. */
const imports = async (path: string, from: string) =>
  (await problems(path, importOf(from), 'no-restricted-imports')).map((m) => m.replace(/^'[^']*' import is restricted from being used by a pattern\. /, ''));

describe('features do not import each other', () => {
  it('refuses another feature by alias, from any folder of a feature', async () => {
    expect(await imports('apps/web/src/features/parts/components/parts-table.tsx', '@/features/photos/api/get-photos')).toEqual([
      'Feature "parts" must not import another feature; compose them in a route module.',
    ]);
    expect(await imports('apps/web/src/features/parts/api/parts.ts', '@/features/photos')).toHaveLength(1);
  });

  it('refuses another feature by a relative path, whatever the depth of the importing file', async () => {
    expect(await imports('apps/web/src/features/parts/components/parts-table.tsx', '../../photos/components/pins')).toEqual([
      'Feature "parts" must not import another feature; compose them in a route module.',
    ]);
    expect(await imports('apps/web/src/features/parts/index.ts', '../photos/api/get-photos')).toHaveLength(1);
    expect(await imports('apps/web/src/features/parts/components/table/row.tsx', '../../../photos/api/get-photos')).toHaveLength(1);
    expect(await imports('apps/web/src/features/parts/components/parts-table.tsx', './../../photos/api/get-photos')).toHaveLength(1);
    // Up past features/ and back down into another feature.
    expect(await imports('apps/web/src/features/parts/components/parts-table.tsx', '../../../features/photos/api/get-photos')).toHaveLength(1);
  });

  it('lets a feature import its own files and shared code', async () => {
    const file = 'apps/web/src/features/parts/components/parts-table.tsx';
    for (const from of ['../api/parts', './part-row', '../../parts/api/parts', '@/features/parts/api/parts', '@/lib/query-keys', '@/components/button', '../../../lib/format']) {
      expect(await imports(file, from), from).toEqual([]);
    }
  });

  it('lets a route module compose features', async () => {
    expect(await imports('apps/web/src/app/routes/teardown.tsx', '@/features/photos/api/get-photos')).toEqual([]);
  });

  it('keeps the web-wide rules inside features (no calc, no API code)', async () => {
    expect(await imports('apps/web/src/features/parts/api/parts.ts', '@splitcase/calc')).toEqual(['The client never computes figures: ask the API.']);
    expect(await imports('apps/web/src/features/parts/api/parts.ts', '@mikro-orm/core')).toEqual(['The web app talks to the API over HTTP only.']);
  });
});

describe('query keys start from rootKeys', () => {
  const file = 'apps/web/src/features/devices/api/list-devices.ts';
  const keyProblems = (code: string, path = file) => problems(path, `import { rootKeys } from '@/lib/query-keys';\n${code}\n`, 'no-restricted-syntax');

  it.each([
    ["qc.invalidateQueries({ queryKey: ['devices'] });", 'a literal root invalidated'],
    ["export const q = { queryKey: ['devices', 'list'] as const };", 'a literal queryKey with as const'],
    ['export const q = { queryKey: [`devices`, 1] };', 'a template-literal root'],
    ["qc.setQueryData(['settings'], {});", 'a literal key of setQueryData'],
    ["export const devicesKey = ['devices', 'list'] as const;", 'a key constant'],
    ["export const lineupScope = (id: number) => ['lineups', id] as const;", 'a key factory'],
  ])('refuses %s (%s)', async (code) => {
    expect(await keyProblems(`declare const qc: { invalidateQueries(o: object): void; setQueryData(k: unknown, v: unknown): void };\n${code}`)).toEqual([
      'A query key starts from rootKeys (lib/query-keys.ts), e.g. [...rootKeys.devices, "list"], never from a literal.',
    ]);
  });

  it('accepts keys built from rootKeys, and other arrays of strings', async () => {
    const code = [
      'declare const qc: { invalidateQueries(o: object): void };',
      'export const devicesKey = [...rootKeys.devices, "list"] as const;',
      'export const scope = (id: number) => [...rootKeys.lineups, id] as const;',
      'qc.invalidateQueries({ queryKey: rootKeys.devices });',
      "export const KINDS = ['discharge', 'charge'] as const;",
      "export const onKey = (k: string) => ['ArrowUp', 'ArrowDown'].includes(k);",
    ].join('\n');
    expect(await keyProblems(code)).toEqual([]);
  });

  it('lets lib/query-keys.ts write the roots', async () => {
    expect(await keyProblems("export const rootKeys2 = { devices: ['devices'] } as const;\nexport const deviceKey = ['devices'] as const;", 'apps/web/src/lib/query-keys.ts')).toEqual([]);
  });
});
