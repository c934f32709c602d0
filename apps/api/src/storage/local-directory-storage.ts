import { randomUUID } from "node:crypto";
import { createReadStream } from "node:fs";
import { link, mkdir, rm, stat, unlink, writeFile } from "node:fs/promises";
import path from "node:path";
import { assertStorageKey, type Storage, type StoredObject } from "./storage.js";

/**
 * Storage in a local directory: one file per key under `root`. A put writes a temporary file and
 * links it into place, so a reader never sees half a file and an existing key is never overwritten.
 */
export class LocalDirectoryStorage implements Storage {
  constructor(private readonly root: string) {}

  private pathOf(key: string): string {
    assertStorageKey(key);
    return path.join(this.root, ...key.split("/"));
  }

  async put(key: string, bytes: Buffer, _contentType: string): Promise<void> {
    const target = this.pathOf(key);
    await mkdir(path.dirname(target), { recursive: true });
    const temp = `${target}.${randomUUID()}.part`;
    await writeFile(temp, bytes, { flag: "wx" });
    try {
      await link(temp, target);
    } finally {
      await unlink(temp).catch(() => undefined);
    }
  }

  async get(key: string): Promise<StoredObject | null> {
    const file = this.pathOf(key);
    try {
      const info = await stat(file);
      if (!info.isFile()) return null;
      return { stream: createReadStream(file), sizeBytes: info.size };
    } catch (error) {
      if ((error as NodeJS.ErrnoException).code === "ENOENT") return null;
      throw error;
    }
  }

  async delete(key: string): Promise<void> {
    await rm(this.pathOf(key), { force: true });
  }
}
