/**
 * Every setting the server reads, declared once. Nothing else reads process.env.
 * The start and test commands fill these in for local use; a deployment sets them itself.
 */
function required(name: string): string {
  const value = process.env[name];
  if (!value) throw new Error(`Missing environment variable ${name}. Start the app with \`npm start\`, or set it.`);
  return value;
}

function optional(name: string, fallback: string): string {
  return process.env[name] || fallback;
}

function positiveInteger(name: string, fallback: number): number {
  const value = process.env[name];
  if (!value) return fallback;
  const n = Number(value);
  if (!Number.isInteger(n) || n < 1) throw new Error(`${name} must be a whole number of at least 1.`);
  return n;
}

export const config = {
  /** PostgreSQL connection string of the app database. */
  get databaseUrl() {
    return required('DATABASE_URL');
  },
  /** The public origin of this app (scheme, host, port), used in e-mailed links and origin checks. */
  get publicOrigin() {
    return optional('PUBLIC_ORIGIN', 'http://127.0.0.1:4321').replace(/\/$/, '');
  },
  /** Cookies get the Secure flag whenever the app is served over HTTPS. */
  get secureCookies() {
    return this.publicOrigin.startsWith('https://');
  },
  /** Browsers are told to use only HTTPS for this host (Strict-Transport-Security) when it is served over it. */
  get servedOverHttps() {
    return this.publicOrigin.startsWith('https://');
  },
  /** Secret for signing tokens (form tokens, invite links). At least 32 characters. */
  get appSecret() {
    const secret = required('APP_SECRET');
    if (secret.length < 32) throw new Error('APP_SECRET must be at least 32 characters.');
    return secret;
  },
  /** Object storage (S3 or the local stand-in). */
  get s3() {
    return {
      endpoint: process.env.S3_ENDPOINT || undefined,
      region: optional('S3_REGION', 'us-east-1'),
      bucket: required('S3_BUCKET'),
      accessKeyId: required('S3_ACCESS_KEY_ID'),
      secretAccessKey: required('S3_SECRET_ACCESS_KEY'),
      forcePathStyle: process.env.S3_FORCE_PATH_STYLE === 'true',
    };
  },
  /** Outgoing mail: an smtp:// or smtps:// URL. */
  get smtpUrl() {
    return required('SMTP_URL');
  },
  get mailFrom() {
    return optional('MAIL_FROM', 'Lapwing <no-reply@lapwing.test>');
  },
  /** Worker threads that work out estimates (ESTIMATE_THREADS, default 2). */
  get estimateThreads() {
    return positiveInteger('ESTIMATE_THREADS', 2);
  },
  /** Longest one estimate may take, waiting for a thread included, in ms (ESTIMATE_TIME_LIMIT_MS, default 5000). */
  get estimateTimeLimitMs() {
    return positiveInteger('ESTIMATE_TIME_LIMIT_MS', 5000);
  },
  /** Folder where the local SMTP stand-in keeps received messages (development only). */
  get devMailDir() {
    return process.env.DEV_MAIL_DIR || null;
  },
};
