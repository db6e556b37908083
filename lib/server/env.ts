import 'server-only';
import { z } from 'zod';

// Environment, parsed once with zod so a bad value fails loudly at the first use.
const dbSchema = z.object({
  DB_HOST: z.string().default('127.0.0.1'),
  DB_PORT: z.coerce.number().int().positive().default(3307),
  /**
   * The server's Unix socket. Used instead of TCP when DB_HOST is this machine and the socket
   * exists: the same server, without the TCP stack's cost on every statement.
   */
  DB_SOCKET: z.string().default(''),
  DB_NAME: z.string().min(1).default('fallbook'),
  DB_USER: z.string().min(1).default('fallbook'),
  DB_PASSWORD: z.string().default(''),
  DB_POOL_MAX: z.coerce.number().int().positive().default(5),
  /** Read replicas, `host:port` separated by commas; empty (the default) means one server for all. */
  DB_READ_HOSTS: z.string().default(''),
  /** Seconds after a person's write during which their reads go to the primary (replica lag). */
  DB_READ_AFTER_WRITE_SECONDS: z.coerce.number().int().min(0).default(10),
});

const appSchema = z.object({
  NEXTAUTH_SECRET: z.string().min(16, 'NEXTAUTH_SECRET must be at least 16 characters'),
  NEXTAUTH_URL: z.string().url().default('http://localhost:3000'),
  SMTP_HOST: z.string().default('127.0.0.1'),
  SMTP_PORT: z.coerce.number().int().positive().default(1025),
  SMTP_USER: z.string().optional(),
  SMTP_PASSWORD: z.string().optional(),
  MAIL_FROM: z.string().default('Fallbook <no-reply@fallbook.test>'),
});

const flag = z
  .enum(['0', '1', 'true', 'false', ''])
  .default('')
  .transform((v) => v === '1' || v === 'true');

const storageSchema = z
  .object({
    /** `local` keeps photos in PHOTO_DIR; `s3` in an S3-compatible bucket. */
    STORAGE_DRIVER: z.enum(['local', 's3']).default('local'),
    /** Folder for photo originals and thumbnails (relative to the app's folder, or absolute). */
    PHOTO_DIR: z.string().min(1).default('.data/photos'),
    S3_ENDPOINT: z.string().url().optional().or(z.literal('')),
    S3_BUCKET: z.string().default(''),
    S3_REGION: z.string().min(1).default('us-east-1'),
    S3_ACCESS_KEY_ID: z.string().optional(),
    S3_SECRET_ACCESS_KEY: z.string().optional(),
    S3_FORCE_PATH_STYLE: flag,
    S3_PREFIX: z
      .string()
      .regex(/^([a-z0-9][a-z0-9._-]*\/)*$/, 'S3_PREFIX must be empty or end with /, e.g. fallbook/')
      .default(''),
    /** With the S3 driver: answer photo downloads (after the access check) with a presigned URL. */
    S3_SIGNED_URLS: flag,
    /** How long such a URL is valid, in seconds. */
    S3_SIGNED_URL_SECONDS: z.coerce.number().int().min(1).max(3600).default(60),
  })
  .refine((env) => env.STORAGE_DRIVER !== 's3' || env.S3_BUCKET.length >= 3, {
    message: 'STORAGE_DRIVER=s3 needs S3_BUCKET (3 to 63 characters)',
    path: ['S3_BUCKET'],
  });

let storageEnvCache: z.infer<typeof storageSchema> | undefined;
let dbEnvCache: z.infer<typeof dbSchema> | undefined;
let appEnvCache: z.infer<typeof appSchema> | undefined;

export function dbEnv() {
  dbEnvCache ??= dbSchema.parse(process.env);
  return dbEnvCache;
}

export function appEnv() {
  appEnvCache ??= appSchema.parse(process.env);
  return appEnvCache;
}

export function storageEnv() {
  storageEnvCache ??= storageSchema.parse(process.env);
  return storageEnvCache;
}
