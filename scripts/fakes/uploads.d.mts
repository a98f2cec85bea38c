// Types for the upload-service fake, for the TypeScript tests that start it.

export interface UploadFakeOptions {
  /** Folder for the fake's credentials, file bytes and records; kept across restarts. */
  stateDir: string;
  /** The app's origin; the completion callback goes to `<appUrl>/api/uploadthing`. */
  appUrl: string;
  /** Loopback port on 127.0.0.1 and ::1; a free one when omitted. */
  port?: number;
  /** How long a PUT that overtakes the app's `/route-metadata` waits for it (default 10 000 ms). */
  registrationTimeoutMs?: number;
  /** How long a PUT waits for the app's callback and `/callback-result` (default 15 000 ms). */
  callbackTimeoutMs?: number;
}

export interface UploadFakeEnv {
  UPLOADTHING_TOKEN: string;
  UPLOADTHING_INGEST_URL: string;
  UPLOADTHING_API_URL: string;
  UPLOADTHING_UFS_HOST: string;
  UPLOADTHING_UFS_APP_ID_LOCATION: "path";
  UPLOADTHING_CALLBACK_URL: string;
  UPLOADTHING_IS_DEV: "false";
}

export interface UploadFake {
  /** The variables that point the uploadthing SDK at this fake. */
  env: UploadFakeEnv;
  port: number;
  stop(): Promise<void>;
}

export function startUploadFake(options: UploadFakeOptions): Promise<UploadFake>;
