import type { Readable } from "node:stream";

/** A stored object's bytes as a stream, with its size. */
export interface StoredObject {
  stream: Readable;
  sizeBytes: number;
}

/**
 * Where uploaded files (cut-log photos) live, addressed by key. Keys are relative paths of
 * lower-case letters, digits, `-`, `_`, `.` and `/` (no `..`), e.g. `shops/<id>/cut-logs/<id>/<id>.jpg`.
 * The local-directory implementation keeps them on disk; an object store can implement the same.
 */
export interface Storage {
  /** Stores `bytes` under `key`, replacing nothing: an existing key is an error. */
  put(key: string, bytes: Buffer, contentType: string): Promise<void>;
  /** The object under `key`, or null when there is none. */
  get(key: string): Promise<StoredObject | null>;
  /** Removes `key`; removing a missing key is not an error. */
  delete(key: string): Promise<void>;
}

const KEY = /^[a-z0-9_-][a-z0-9._-]*(\/[a-z0-9_-][a-z0-9._-]*)*$/;

/** Throws for a key that is not a plain relative path (guards against `..` and absolute paths). */
export function assertStorageKey(key: string): void {
  if (!KEY.test(key) || key.split("/").some((part) => part === "." || part === "..") || key.length > 400) {
    throw new Error(`Invalid storage key: ${JSON.stringify(key)}`);
  }
}
