import { mkdtemp, readdir, rm } from "node:fs/promises";
import os from "node:os";
import path from "node:path";
import { text } from "node:stream/consumers";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { LocalDirectoryStorage } from "./local-directory-storage.js";
import { assertStorageKey } from "./storage.js";

describe("LocalDirectoryStorage", () => {
  let root: string;
  let storage: LocalDirectoryStorage;
  beforeAll(async () => {
    root = await mkdtemp(path.join(os.tmpdir(), "ringdown-storage-"));
    storage = new LocalDirectoryStorage(root);
  });
  afterAll(async () => rm(root, { recursive: true, force: true }));

  it("puts, gets and deletes an object by key", async () => {
    await storage.put("shops/a/cut-logs/b/c.png", Buffer.from("hello"), "image/png");
    const got = await storage.get("shops/a/cut-logs/b/c.png");
    expect(got?.sizeBytes).toBe(5);
    expect(await text(got!.stream)).toBe("hello");
    await storage.delete("shops/a/cut-logs/b/c.png");
    expect(await storage.get("shops/a/cut-logs/b/c.png")).toBeNull();
    // Deleting again is fine; no temporary files are left behind.
    await storage.delete("shops/a/cut-logs/b/c.png");
    expect(await readdir(path.join(root, "shops/a/cut-logs/b"))).toEqual([]);
  });

  it("never overwrites an existing key", async () => {
    await storage.put("x/one.jpg", Buffer.from("first"), "image/jpeg");
    await expect(storage.put("x/one.jpg", Buffer.from("second"), "image/jpeg")).rejects.toThrow();
    expect(await text((await storage.get("x/one.jpg"))!.stream)).toBe("first");
    expect((await readdir(path.join(root, "x"))).sort()).toEqual(["one.jpg"]);
  });

  it("refuses keys that could leave the directory", () => {
    for (const bad of ["../etc/passwd", "/abs", "a/../b", "a//b", "A/B", "a/./b", ""]) {
      expect(() => assertStorageKey(bad), bad).toThrow(/Invalid storage key/);
    }
    expect(() => assertStorageKey("shops/1f/cut-logs/2a/3b.webp")).not.toThrow();
  });
});
