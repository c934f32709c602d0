import { execFile } from "node:child_process";
import path from "node:path";
import { repoRoot } from "../config/env.js";

export interface ScriptResult {
  code: number;
  stdout: string;
  stderr: string;
}

/**
 * Runs one of the repository's bash scripts (path relative to the repository root) and resolves
 * with its exit code and output, whatever the code; rejects only when bash cannot be started.
 */
export function runScript(script: string, args: string[], env: Record<string, string> = {}, timeoutMs = 120_000): Promise<ScriptResult> {
  return new Promise((resolve, reject) => {
    execFile(
      "bash",
      [path.join(repoRoot, script), ...args],
      { cwd: repoRoot, env: { ...process.env, ...env }, timeout: timeoutMs, maxBuffer: 16 * 1024 * 1024 },
      (error, stdout, stderr) => {
        const code = error ? (typeof error.code === "number" ? error.code : null) : 0;
        if (code === null) reject(new Error(`${script} did not run: ${error?.message ?? "unknown"}\n${stderr}`));
        else resolve({ code, stdout, stderr });
      },
    );
  });
}
