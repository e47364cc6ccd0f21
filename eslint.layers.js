// The layers the linter keeps (DEVELOPERS.md, "Layers"): screens never read db/, islands never load *.server
// modules, the domain (src/lib) never imports a screen, and imports climb at most one folder (the aliases do the rest).
// ESLint takes a rule's options from the last config object that matches a file, so each region below lists every
// restriction that applies to it, from the widest region to the narrowest.

const climb = {
  regex: '^\\.\\./\\.\\./',
  message: "Do not climb more than one folder ('../../'): import from '@/…' (src/) or '@db/…' (db/) instead.",
};

const database = {
  regex: '^(@db|(\\.\\./)+db)(/|$)',
  message:
    'Screens (pages, API routes, layouts, components, block views) do not read db/: call a function in src/lib/<domain>/ (a *.server.ts module) that does, and import that.',
};

const serverModule = {
  regex: '\\.server(\\.[cm]?[jt]sx?)?$',
  message:
    "Islands run in the browser: never import a *.server module, not even 'import type'. Take view types from the domain's plain module (e.g. '@/lib/reviews/views') and data through api().",
};

const screen = [
  {
    regex: '^(@/|(\\.\\./)+)(components|pages|layouts)(/|$)',
    message:
      'The domain (src/lib) never imports a screen: pass what it needs in from the page or route, or move the code that needs a component out of src/lib.',
  },
  {
    regex: '^(@/|(\\.\\./)+)blocks/[^/]+/(Settings|Render)(\\.tsx)?$',
    message:
      "The domain (src/lib) never imports a block's Settings or Render view: read the block's definition instead, and leave its views to the screens.",
  },
  {
    regex: '\\.astro$',
    message: 'The domain (src/lib) never imports an .astro screen: let the page import the domain, not the other way round.',
  },
];

const restrict = (...patterns) => ({ 'no-restricted-imports': ['error', { patterns: patterns.flat() }] });

// A type written as import('…') is an import too; islands may not reach a *.server module that way either.
const islandTypeImports = {
  'no-restricted-syntax': [
    'error',
    { selector: 'TSImportType[source.value=/\\.server(\\.[cm]?[jt]sx?)?$/]', message: serverModule.message },
    { selector: 'ImportExpression[source.value=/\\.server(\\.[cm]?[jt]sx?)?$/]', message: serverModule.message },
  ],
};

export const screens = ['src/pages/**', 'src/layouts/**', 'src/components/**', 'src/blocks/**', 'src/site/**'];
// Islands and the browser code they import: everything under src/components but .astro, and block views.
export const islands = ['src/components/**/*.{ts,tsx}', 'src/blocks/**/*.{ts,tsx}'];

export default [
  { files: ['src/**'], rules: restrict(climb) },
  { files: ['src/lib/**'], rules: restrict(climb, screen) },
  { files: screens, rules: restrict(climb, database) },
  { files: islands, rules: { ...restrict(climb, database, serverModule), ...islandTypeImports } },
];
