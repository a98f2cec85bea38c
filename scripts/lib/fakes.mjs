// Local stand-ins for the hosted services the product uses (e-mail, file uploads), started with the app.
// Each fake adds the environment variables that point the product's real SDKs at it.

/**
 * @param {{ stateDir: string, appUrl: string }} options
 * @returns {Promise<{ env: Record<string, string> }>}
 */
export async function startFakes({ stateDir, appUrl }) {
  void stateDir;
  void appUrl;
  return { env: {} };
}
