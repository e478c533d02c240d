/**
 * Beadloom's dependency rules (docs/architecture.md, "Layers and what enforces them"), checked by
 * `npm run lint:deps` (scripts/lint-deps.mjs runs dependency-cruiser's API over src/ and server/).
 * Type-only imports count: a type import still ties two folders together.
 */

/** Node built-ins and packages that do I/O; the chemistry core may import none of them. */
const IO_MODULES = [
  '^(node:)?(fs|fs/promises|net|http|https|http2|dgram|dns|tls|child_process|cluster|worker_threads|readline)$',
  '(^|/)node_modules/(knex|mysql2|express|express-session|ws|nodemailer|smtp-server|multer|archiver|pino|pino-http)/',
];

module.exports = {
  forbidden: [
    {
      name: 'chem-is-pure',
      comment: 'server/chem is the pure scientific core: no file, network or database I/O, no Express, no sockets.',
      severity: 'error',
      from: { path: '^server/chem/' },
      to: { path: IO_MODULES },
    },
    {
      name: 'chem-imports-only-chem-and-shared',
      comment: 'server/chem depends on nothing of the app but itself and the shared contracts.',
      severity: 'error',
      from: { path: '^server/chem/' },
      to: { path: '^(server|src)/', pathNot: ['^server/chem/', '^src/shared/'] },
    },
    {
      name: 'server-uses-only-shared-client-code',
      comment: 'The server imports only the shared contracts (src/shared) from the client side.',
      severity: 'error',
      from: { path: '^server/' },
      to: { path: '^src/', pathNot: '^src/shared/' },
    },
    {
      name: 'client-never-imports-server',
      comment: 'The client (src) never imports server code; shared contracts live in src/shared.',
      severity: 'error',
      from: { path: '^src/' },
      to: { path: '^server/' },
    },
    {
      name: 'shared-is-shared',
      comment: 'src/shared imports no React, Express, Knex or client code: both sides load it.',
      severity: 'error',
      from: { path: '^src/shared/' },
      to: { path: ['^src/(?!shared/)', '(^|/)node_modules/(react|react-dom|react-router|@tanstack/[^/]+|express|knex|mysql2)/'] },
    },
    {
      name: 'features-do-not-reach-into-each-other',
      comment: 'A feature (src/features/X) does not import another feature; shared pieces go to src/components, src/lib or src/hooks.',
      severity: 'error',
      from: { path: '^src/features/([^/]+)/' },
      to: { path: '^src/features/([^/]+)/', pathNot: '^src/features/$1/' },
    },
    {
      name: 'no-cycles-between-folders',
      comment: 'Folders depend on each other one way only (routes → services → db/chem).',
      severity: 'error',
      scope: 'folder',
      from: {},
      to: { circular: true },
    },
  ],
  options: {
    doNotFollow: { path: 'node_modules' },
    exclude: { path: '\\.d\\.ts$' },
    tsPreCompilationDeps: true,
    tsConfig: { fileName: 'tsconfig.json' },
    enhancedResolveOptions: {
      exportsFields: ['exports'],
      conditionNames: ['import', 'require', 'node', 'default', 'types'],
      extensions: ['.ts', '.tsx', '.js', '.mjs', '.cjs', '.json'],
    },
  },
};
