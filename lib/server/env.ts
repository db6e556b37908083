import 'server-only';
import { z } from 'zod';

// Environment, parsed once with zod so a bad value fails loudly at the first use.
const dbSchema = z.object({
  DB_HOST: z.string().default('127.0.0.1'),
  DB_PORT: z.coerce.number().int().positive().default(3307),
  DB_NAME: z.string().min(1).default('fallbook'),
  DB_USER: z.string().min(1).default('fallbook'),
  DB_PASSWORD: z.string().default(''),
  DB_POOL_MAX: z.coerce.number().int().positive().default(5),
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

const storageSchema = z.object({
  /** Folder for photo originals and thumbnails (relative to the app's folder, or absolute). */
  PHOTO_DIR: z.string().min(1).default('.data/photos'),
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
