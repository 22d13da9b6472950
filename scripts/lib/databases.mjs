// The two private instances: one for `npm start`, one thrown away by `npm test`. Ports are
// overridable so two checkouts on one machine do not collide.
export const databases = {
  app: {
    dir: '.data/db',
    port: Number(process.env.SHEDWRIGHT_DB_PORT ?? 4781),
    database: 'shedwright',
    user: 'shedwright',
  },
  test: {
    // A second port gets its own data directory, so two test runs never share one.
    dir: process.env.SHEDWRIGHT_TEST_DB_PORT ? `.data/test-db-${process.env.SHEDWRIGHT_TEST_DB_PORT}` : '.data/test-db',
    port: Number(process.env.SHEDWRIGHT_TEST_DB_PORT ?? 4791),
    database: 'shedwright_test',
    user: 'shedwright',
  },
};
