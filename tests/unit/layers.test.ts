// The layers the linter keeps (DEVELOPERS.md, "Layers"), checked by ESLint itself: the project's own eslint.config.js
// lints small snippets placed at made-up paths through ESLint's Node API (`ESLint#lintText` with `filePath`, documented
// at eslint.org/docs/latest/integrate/nodejs-api). A back-flowing import must come back as an error of the import rule.
import { fileURLToPath } from 'node:url';
import { ESLint, type Linter } from 'eslint';
import { beforeAll, describe, expect, it } from 'vitest';

const root = fileURLToPath(new URL('../../', import.meta.url));
let eslint: ESLint;

/** The layer errors (import rules only) ESLint reports for `code` at `path`. */
async function layerErrors(path: string, code: string): Promise<Linter.LintMessage[]> {
  const [result] = await eslint.lintText(code, { filePath: `${root}${path}` });
  return result.messages.filter((m) => m.ruleId === 'no-restricted-imports' || m.ruleId === 'no-restricted-syntax');
}

const refused = async (path: string, code: string, says: RegExp) => {
  const errors = await layerErrors(path, code);
  expect(errors.length, `${path} should be refused`).toBeGreaterThan(0);
  expect(errors.every((e) => e.severity === 2)).toBe(true);
  expect(errors.map((e) => e.message).join('\n')).toMatch(says);
};

const allowed = async (path: string, code: string) => expect(await layerErrors(path, code)).toEqual([]);

const astro = (frontmatter: string) => `---\n${frontmatter}\n---\n<p>{String(x)}</p>\n`;

beforeAll(async () => {
  eslint = new ESLint({ cwd: root });
  await eslint.lintText('export {};\n', { filePath: `${root}src/lib/warm-up.ts` }); // loads the parsers once
}, 120_000);

describe('screens never read db/', () => {
  it('refuses a page, an API route, a layout, a component and a block view importing db/', async () => {
    await refused('src/pages/app/brands/[id]/x.astro', astro("import { BrandColor } from '@db/models';\nconst x = BrandColor;"), /do not read db\//);
    await refused('src/pages/api/brands/[id]/x.ts', "import { Asset } from '@db/models/assets';\nexport const x = Asset;\n", /do not read db\//);
    await refused('src/layouts/X.astro', astro("import { Brand } from '../../db/models';\nconst x = Brand;"), /do not read db\//);
    await refused('src/components/app/X.astro', astro("import { Brand } from '@db/models';\nconst x = Brand;"), /do not read db\//);
    await refused('src/blocks/palette/Render.tsx', "import { Brand } from '@db/models';\nexport const x = Brand;\n", /do not read db\//);
  });

  it('lets a page call the domain, even its *.server modules', async () => {
    await allowed('src/pages/api/brands/[id]/x.ts', "import { brandPalette } from '@/lib/identity/palette.server';\nexport const x = brandPalette;\n");
    await allowed('src/pages/app/x.astro', astro("import { brandPage } from '@/lib/brands/brand-page.server';\nconst x = brandPage;"));
  });
});

describe('islands never load *.server modules', () => {
  it('refuses a value import, an import type, a .server.ts path and an import() type', async () => {
    await refused('src/components/app/X.tsx', "import { listShareLinks } from '@/lib/publishing/share-links.server';\nexport const x = listShareLinks;\n", /Islands run in the browser/);
    await refused('src/components/editor/X.tsx', "import type { CommentView } from '@/lib/reviews/reviews.server';\nexport const x = (c: CommentView) => c;\n", /not even 'import type'/);
    await refused('src/components/app/x.ts', "import { hashToken } from '@/lib/brands/brands.server.ts';\nexport const x = hashToken;\n", /Islands run in the browser/);
    await refused('src/components/app/X.tsx', "export type X = import('@/lib/reviews/reviews.server').CommentView;\n", /Islands run in the browser/);
    await refused('src/blocks/palette/Settings.tsx', "import type { AssetView } from '@/lib/assets/assets.server';\nexport const x = (a: AssetView) => a;\n", /Islands run in the browser/);
  });

  it('lets an island read view types from the plain module, and an .astro component call the server', async () => {
    await allowed('src/components/editor/X.tsx', "import type { CommentView } from '@/lib/reviews/views';\nimport { api } from '@/lib/client/api';\nexport const x = (c: CommentView) => [c, api];\n");
    await allowed('src/components/app/X.astro', astro("import { brandPage } from '@/lib/brands/brand-page.server';\nconst x = brandPage;"));
  });
});

describe('the domain never imports a screen', () => {
  it('refuses components, pages, layouts, .astro files and a block’s Settings or Render view', async () => {
    await refused('src/lib/publishing/x.ts', "import GuidelineDocument from '@/components/guideline/GuidelineDocument';\nexport const x = GuidelineDocument;\n", /never imports a screen/);
    await refused('src/lib/brands/x.ts', "import Base from '@/layouts/Base.astro';\nexport const x = Base;\n", /never imports a screen/);
    await refused('src/lib/x.ts', "import { GET } from '../pages/api/health';\nexport const x = GET;\n", /never imports a screen/);
    await refused('src/lib/guideline/x.ts', "import Render from '@/blocks/palette/Render';\nexport const x = Render;\n", /Settings or Render view/);
    await refused('src/lib/guideline/x.ts', "import Settings from '@/blocks/palette/Settings.tsx';\nexport const x = Settings;\n", /Settings or Render view/);
  });

  it('lets the domain read db/, other domain modules and a block’s definition', async () => {
    await allowed('src/lib/brands/x.ts', "import { Brand } from '@db/models';\nimport { parseColor } from '@/lib/color';\nimport { definition } from '@/blocks/palette/definition';\nexport const x = [Brand, parseColor, definition];\n");
  });
});

describe('imports climb at most one folder', () => {
  it("refuses '../../' anywhere in src/ and names the aliases", async () => {
    await refused('src/lib/publishing/x.ts', "import { parseColor } from '../../lib/color';\nexport const x = parseColor;\n", /'@\/…' \(src\/\) or '@db\/…'/);
    await refused('src/pages/app/x.astro', astro("import Base from '../../layouts/Base.astro';\nconst x = Base;"), /Do not climb/);
    await refused('src/components/app/client/X.tsx', "import { api } from '../../../lib/client/api';\nexport const x = api;\n", /Do not climb/);
  });

  it("lets a file reach its own folder and its parent's", async () => {
    await allowed('src/components/app/client/X.tsx', "import { BoardPiece } from './BoardPiece';\nimport { QueryRoot } from '../QueryRoot';\nexport const x = [BoardPiece, QueryRoot];\n");
  });
});
