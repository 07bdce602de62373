// One jest run covers every suite; `scripts/test.ts` prepares the database and the web build first.
const swc = [
  '@swc/jest',
  {
    jsc: { parser: { syntax: 'typescript', tsx: true }, target: 'es2022', transform: { react: { runtime: 'automatic' } } },
    module: { type: 'commonjs' },
  },
];

const nodeProject = (displayName, roots, extra = {}) => ({
  displayName,
  testEnvironment: 'node',
  roots,
  transform: { '^.+\\.(t|j)sx?$': swc },
  moduleNameMapper: { '^@/(.*)$': '<rootDir>/$1' },
  testMatch: ['**/*.test.ts'],
  ...extra,
});

module.exports = {
  // Browser tests and the contention test need more than jest's 5 s default.
  testTimeout: 60_000,
  projects: [
    nodeProject('unit', ['<rootDir>/tests/unit']),
    nodeProject('api', ['<rootDir>/tests/api']),
    nodeProject('e2e', ['<rootDir>/tests/e2e']),
    nodeProject('faults', ['<rootDir>/tests/faults']),
    // `npm run test:cluster` only (scripts/test-cluster.ts sets the variable): it needs the Galera
    // cluster, kills nodes and processes, and takes minutes; plain `npm test` never loads it.
    ...(process.env.VOLTCRIB_CLUSTER_TESTS === '1' ? [nodeProject('cluster', ['<rootDir>/tests/cluster'])] : []),
  ],
};
