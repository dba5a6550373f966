// What `npm test` hands the server's tests: a fresh database (already migrated) and a maildev
// instance on free ports. Running these tests without it fails with a clear message.
function required(name: string): string {
  const value = process.env[name];
  if (!value)
    throw new Error(
      `${name} is not set: run the server tests through \`npm test\` (e.g. npm test -- --project server)`,
    );
  return value;
}

export const testEnv = {
  get databaseUrl() {
    return required('DATABASE_URL');
  },
  get smtpPort() {
    return Number(required('SMTP_PORT'));
  },
  get maildevApiUrl() {
    return required('MAILDEV_API_URL');
  },
};
