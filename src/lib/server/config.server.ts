// Server-only: reads the environment once. The .server suffix keeps it out of island bundles.
function env(name: string, fallback?: string): string {
  const value = process.env[name] ?? fallback;
  if (value === undefined) {
    throw new Error(`${name} is not set. Start the app with \`npm start\`, which sets it, or export it yourself.`);
  }
  return value;
}

export const config = {
  get databaseUrl() {
    return env('DATABASE_URL');
  },
  /** Connections in this process's pool (default 10). */
  get databasePoolSize() {
    return Number(env('DATABASE_POOL_SIZE', '10'));
  },
  /** false behind a transaction-mode connection pooler: postgres.js then sends no named prepared statements. */
  get databasePrepare() {
    return env('DATABASE_PREPARE', 'true') !== 'false';
  },
  get authSecret() {
    return env('AUTH_SECRET');
  },
  get appUrl() {
    return env('APP_URL', `http://127.0.0.1:${process.env.PORT ?? 4321}`).replace(/\/$/, '');
  },
  get smtp() {
    return {
      host: env('SMTP_HOST', '127.0.0.1'),
      port: Number(env('SMTP_PORT', '1025')),
      user: process.env.SMTP_USER,
      pass: process.env.SMTP_PASS,
      secure: process.env.SMTP_SECURE === 'true',
    };
  },
  get mailFrom() {
    return env('MAIL_FROM', 'Groundwork <no-reply@groundwork.example.com>');
  },
  get officeEmail() {
    return env('OFFICE_EMAIL', 'office@example.com');
  },
  get uploadDir() {
    return env('UPLOAD_DIR', '.data/uploads');
  },
  /** Where uploads are kept: `local` (UPLOAD_DIR) or `s3` (a bucket; UPLOAD_DIR then holds only scratch files). */
  get storage() {
    const driver = env('STORAGE_DRIVER', 'local');
    if (driver !== 'local' && driver !== 's3') throw new Error(`STORAGE_DRIVER must be "local" or "s3", not "${driver}".`);
    return {
      driver,
      s3: {
        bucket: driver === 's3' ? env('S3_BUCKET') : (process.env.S3_BUCKET ?? ''),
        region: env('S3_REGION', 'us-east-1'),
        endpoint: process.env.S3_ENDPOINT || undefined,
        accessKeyId: process.env.S3_ACCESS_KEY_ID || undefined,
        secretAccessKey: process.env.S3_SECRET_ACCESS_KEY || undefined,
        forcePathStyle: process.env.S3_FORCE_PATH_STYLE === 'true',
      },
    } as const;
  },
  /**
   * Text messages through the SMS provider (docs/decisions/008-sms-provider.md). All four of key,
   * secret, signature secret and sender must be set, else texts are off and nothing else changes.
   */
  get sms(): { apiKey: string; apiSecret: string; signatureSecret: string; signatureMethod: string; from: string; restHost?: string } | null {
    const apiKey = process.env.VONAGE_API_KEY;
    const apiSecret = process.env.VONAGE_API_SECRET;
    const signatureSecret = process.env.VONAGE_SIGNATURE_SECRET;
    const from = process.env.SMS_FROM;
    if (!apiKey || !apiSecret || !signatureSecret || !from) return null;
    return {
      apiKey,
      apiSecret,
      signatureSecret,
      signatureMethod: process.env.VONAGE_SIGNATURE_METHOD ?? 'sha256',
      from,
      restHost: process.env.VONAGE_REST_HOST || undefined,
    };
  },
  /** The vehicle enquiry service: off unless an API key is set. */
  get vehicleEnquiry(): { apiKey: string; url: string; timeoutMs: number; perCustomerPerHour: number } | null {
    const apiKey = process.env.VEHICLE_ENQUIRY_API_KEY;
    if (!apiKey) return null;
    return {
      apiKey,
      // From memory of the service's public documentation: the production endpoint.
      url: (process.env.VEHICLE_ENQUIRY_URL ?? 'https://driver-vehicle-licensing.api.gov.uk/vehicle-enquiry/v1/vehicles').replace(/\/$/, ''),
      timeoutMs: Number(process.env.VEHICLE_ENQUIRY_TIMEOUT_MS ?? 2000),
      perCustomerPerHour: Number(process.env.RATE_LIMIT_VEHICLE_LOOKUPS_PER_HOUR ?? 20),
    };
  },
  get isTest() {
    return process.env.GROUNDWORK_TEST === '1';
  },
};
