// @vitest-environment node
/**
 * The client's import boundaries (DEVELOPERS.md, "Layout"), as ESLint enforces them with the
 * project's own eslint.config.js: each case lints one line of source as if it stood in a file
 * of that layer.
 */
import path from 'node:path';
import { ESLint } from 'eslint';
import { describe, expect, it } from 'vitest';

const root = path.resolve(import.meta.dirname, '../..');
const eslint = new ESLint({ cwd: root });

async function restricted(file: string, source: string): Promise<string[]> {
  const [result] = await eslint.lintText(`${source}\nexport const used = x;\n`, {
    filePath: path.join(root, file),
  });
  return result.messages.filter((m) => m.ruleId === 'no-restricted-imports').map((m) => m.message);
}

describe('client import boundaries', () => {
  it('refuses a feature importing another feature, but not its query-key factory', async () => {
    const file = 'src/features/tastes/components/probe.tsx';
    expect(
      await restricted(file, "import { x } from '@/features/runs/components/run-form';"),
    ).toHaveLength(1);
    expect(await restricted(file, "import { x } from '@/features/runs/api/run-keys';")).toEqual([]);
  });

  it('refuses a shared layer importing a feature', async () => {
    const file = 'src/components/ui/probe.tsx';
    expect(
      await restricted(file, "import { x } from '@/features/runs/api/run-keys';"),
    ).toHaveLength(1);
  });

  it('lets route modules compose features', async () => {
    const file = 'src/app/routes/probe.tsx';
    expect(
      await restricted(file, "import { x } from '@/features/runs/components/run-form';"),
    ).toEqual([]);
  });

  it('refuses client code importing from the server or the data layer', async () => {
    for (const file of [
      'src/features/design/components/probe.tsx',
      'src/app/probe.tsx',
      'src/components/ui/probe.tsx',
    ]) {
      expect(
        await restricted(
          file,
          "import { x } from '@server/engine/design/diagnostics/diagnose-design';",
        ),
      ).toHaveLength(1);
      expect(await restricted(file, "import { x } from '@db/schema';")).toHaveLength(1);
      expect(
        await restricted(file, "import { x } from '@shared/schemas/design-diagnostics';"),
      ).toEqual([]);
    }
  });
});
