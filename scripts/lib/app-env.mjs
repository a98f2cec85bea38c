// The environment the app and its helper scripts run with, the same for `npm start` and `npm test`.

/**
 * @param {{ databaseUrl: string, appUrl: string, secrets: { authSecret: string }, nodeEnv: string, extra?: Record<string,string> }} o
 */
export function appEnvironment({ databaseUrl, appUrl, secrets, nodeEnv, extra = {} }) {
  return {
    ...process.env,
    NODE_ENV: nodeEnv,
    DATABASE_URL: databaseUrl,
    NEXTAUTH_URL: appUrl,
    NEXTAUTH_SECRET: secrets.authSecret,
    NEXT_TELEMETRY_DISABLED: "1",
    ...extra,
  };
}
