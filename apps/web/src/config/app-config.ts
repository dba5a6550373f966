/** Settings the web app reads in one place. The API is always same-origin under `/api`. */
export const appConfig = {
  productName: 'Biasproof',
  apiBasePath: '/api',
  /** How often the header re-checks the server and database, in milliseconds. */
  healthRefetchIntervalMs: 30_000,
} as const;
