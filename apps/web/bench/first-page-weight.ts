/**
 * First-page weight: how much JavaScript a first visit to the sign-in page downloads, gzipped.
 * Builds the web app for production (this app's vite.config.ts, with a manifest) into a scratch
 * folder, then follows the Vite manifest: the entry chunk and its static imports, plus the sign-in
 * route's chunk and its static imports (the router loads that route on arrival). Every other chunk
 * is loaded later, on demand, and is listed separately. Figures only; nothing asserted.
 *
 *   npm run bench -w @ringdown/web
 */
import { mkdtempSync, readFileSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { gzipSync } from "node:zlib";
import { build, type Manifest, type ManifestChunk } from "vite";

const root = fileURLToPath(new URL("../", import.meta.url));
const SIGN_IN_ROUTE = "src/app/routes/auth/sign-in.tsx";
const TARGET_KB = 200;

const outDir = mkdtempSync(path.join(tmpdir(), "ringdown-web-weight-"));
try {
  await build({ root, logLevel: "warn", build: { outDir, emptyOutDir: true, manifest: true, sourcemap: false } });
  const manifest = JSON.parse(readFileSync(path.join(outDir, ".vite/manifest.json"), "utf8")) as Manifest;

  const entries = Object.entries(manifest).filter(([, chunk]) => chunk.isEntry);
  if (entries.length !== 1) throw new Error(`expected one entry chunk in the manifest, found ${entries.length}`);
  if (!manifest[SIGN_IN_ROUTE]) throw new Error(`the manifest has no chunk for ${SIGN_IN_ROUTE}`);

  /** The chunk under `key` and everything it imports statically, once each. */
  const staticClosure = (key: string, into: Set<string>): Set<string> => {
    if (into.has(key)) return into;
    into.add(key);
    for (const imported of manifest[key]!.imports ?? []) staticClosure(imported, into);
    return into;
  };
  const first = staticClosure(entries[0]![0], new Set());
  staticClosure(SIGN_IN_ROUTE, first);

  const sizes = (chunk: ManifestChunk) => {
    const bytes = readFileSync(path.join(outDir, chunk.file));
    return { raw: bytes.length, gzip: gzipSync(bytes).length };
  };
  const kb = (n: number) => `${(n / 1024).toFixed(1)} KB`;
  const name = (key: string, chunk: ManifestChunk) => (chunk.src ?? key.replace(/^_/, "(shared) "));

  console.log(`First visit to the sign-in page: JavaScript loaded (gzip, node:zlib default level)`);
  let raw = 0;
  let gzip = 0;
  for (const key of first) {
    const chunk = manifest[key]!;
    const s = sizes(chunk);
    raw += s.raw;
    gzip += s.gzip;
    console.log(`  ${kb(s.gzip).padStart(9)} gzip ${kb(s.raw).padStart(10)} raw  ${name(key, chunk)}  (${chunk.file})`);
  }
  const css = [...first].flatMap((key) => manifest[key]!.css ?? []);
  const cssGzip = [...new Set(css)].reduce((t, file) => t + gzipSync(readFileSync(path.join(outDir, file))).length, 0);
  console.log(`  total ${kb(gzip)} gzip (${kb(raw)} raw) against a target of ${TARGET_KB} KB: ${gzip <= TARGET_KB * 1024 ? "within" : "OVER"}`);
  console.log(`  (stylesheets on the same visit: ${kb(cssGzip)} gzip, not counted above)`);

  console.log(`\nLoaded later, on demand (not on the sign-in page)`);
  const later = Object.entries(manifest)
    .filter(([key, chunk]) => !first.has(key) && chunk.file.endsWith(".js"))
    .map(([key, chunk]) => ({ label: name(key, chunk), file: chunk.file, ...sizes(chunk) }))
    .sort((a, b) => b.gzip - a.gzip);
  for (const c of later) console.log(`  ${kb(c.gzip).padStart(9)} gzip ${kb(c.raw).padStart(10)} raw  ${c.label}  (${c.file})`);
  console.log(`  ${later.length} chunks, ${kb(later.reduce((t, c) => t + c.gzip, 0))} gzip in all`);
} finally {
  rmSync(outDir, { recursive: true, force: true });
}
