import 'server-only';
import { createReadStream } from 'node:fs';
import { stat } from 'node:fs/promises';
import { DeleteObjectCommand, GetObjectCommand, PutObjectCommand, S3Client, S3ServiceException } from '@aws-sdk/client-s3';
import { getSignedUrl } from '@aws-sdk/s3-request-presigner';
import { assertSafeKey, type BlobStorage } from './types';

export interface S3Settings {
  endpoint?: string;
  bucket: string;
  region: string;
  accessKeyId?: string;
  secretAccessKey?: string;
  /** Path-style URLs (`endpoint/bucket/key`): most self-hosted stores want this. */
  forcePathStyle: boolean;
  /** Prefix put before every key, so several apps can share one bucket. */
  prefix: string;
  /** When > 0, downloads are answered with a presigned URL valid this many seconds (S3_SIGNED_URLS). */
  signedUrlSeconds?: number;
}

const missing = (error: unknown) =>
  error instanceof S3ServiceException && (error.name === 'NoSuchKey' || error.name === 'NotFound' || error.$metadata.httpStatusCode === 404);

/** Keeps blobs as objects in an S3-compatible bucket (AWS S3, MinIO, Ceph, Garage, …). */
export function s3Storage(settings: S3Settings, client = s3Client(settings)): BlobStorage {
  const target = (key: string) => {
    assertSafeKey(key);
    return { Bucket: settings.bucket, Key: `${settings.prefix}${key}` };
  };
  const storage: BlobStorage = {
    async put(key, data, contentType) {
      // One PUT: the object appears whole or not at all (the SDK adds a checksum the store verifies).
      await client.send(new PutObjectCommand({ ...target(key), Body: data, ContentType: contentType, ContentLength: data.length }));
    },
    async putFile(key, file, contentType, sha256) {
      // One streamed PUT with the length known up front; with the hash given, the store checks the
      // bytes against it (x-amz-checksum-sha256) and the SDK need not read the file a second time.
      const { size } = await stat(file);
      await client.send(
        new PutObjectCommand({
          ...target(key),
          Body: createReadStream(file),
          ContentType: contentType,
          ContentLength: size,
          ...(sha256 ? { ChecksumSHA256: Buffer.from(sha256, 'hex').toString('base64') } : {}),
        }),
      );
    },
    async get(key) {
      try {
        const out = await client.send(new GetObjectCommand(target(key)));
        if (!out.Body) return null;
        return Buffer.from(await out.Body.transformToByteArray());
      } catch (error) {
        if (missing(error)) return null;
        throw error;
      }
    },
    async open(key) {
      try {
        const out = await client.send(new GetObjectCommand(target(key)));
        if (!out.Body) return null;
        return { body: out.Body.transformToWebStream(), size: Number(out.ContentLength ?? 0) };
      } catch (error) {
        if (missing(error)) return null;
        throw error;
      }
    },
    async remove(key) {
      await client.send(new DeleteObjectCommand(target(key)));
    },
  };
  const seconds = settings.signedUrlSeconds ?? 0;
  if (seconds > 0) storage.signedUrl = (key) => getSignedUrl(client, new GetObjectCommand(target(key)), { expiresIn: seconds });
  return storage;
}

/** An SDK client for the settings; credentials fall back to the SDK's usual chain when not given. */
export function s3Client(settings: S3Settings): S3Client {
  return new S3Client({
    region: settings.region,
    endpoint: settings.endpoint || undefined,
    forcePathStyle: settings.forcePathStyle,
    credentials:
      settings.accessKeyId && settings.secretAccessKey ? { accessKeyId: settings.accessKeyId, secretAccessKey: settings.secretAccessKey } : undefined,
    maxAttempts: 3,
  });
}
