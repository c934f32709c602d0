import {
  apiErrorSchema,
  cutterImportErrorSchema,
  cutterImportReportSchema,
  type CutterImportReport,
} from "@ringdown/contracts";
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { shopApiPath } from "@/lib/active-shop";
import { ApiError } from "@/lib/api-client";
import { cuttersKey } from "./get-cutters";

/** What the server said about a file: its row-by-row report, and the refusal if it wrote nothing. */
export interface ImportOutcome {
  report: CutterImportReport;
  /** Set when the import was refused as a whole (invalid rows: nothing was written). */
  refused: { code: string; message: string } | null;
}

/**
 * Sends a cutter CSV (multipart field `file`). With `dryRun` the server only checks it and
 * answers each row as valid or with its errors; without, it imports all rows in one transaction
 * or none. A refusal that carries a report resolves (the report is what the person needs);
 * anything else rejects with an ApiError.
 */
export async function importCutters(shopId: string, file: Blob, fileName: string, dryRun: boolean): Promise<ImportOutcome> {
  const form = new FormData();
  form.append("file", file, fileName);
  let response: Response;
  try {
    response = await fetch(`/api${shopApiPath(shopId, `/cutters/import${dryRun ? "?dryRun=true" : ""}`)}`, {
      method: "POST",
      body: form,
      credentials: "same-origin",
      headers: { Accept: "application/json" },
    });
  } catch {
    throw new ApiError(0, "network_error", "Cannot reach the Ringdown server. Check the connection and try again.");
  }
  const text = await response.text();
  let payload: unknown;
  try {
    payload = text ? (JSON.parse(text) as unknown) : undefined;
  } catch {
    payload = undefined;
  }
  if (response.ok) {
    const parsed = cutterImportReportSchema.safeParse(payload);
    if (!parsed.success) throw new ApiError(response.status, "bad_response", "The server's answer about the file did not have the expected shape.");
    return { report: parsed.data, refused: null };
  }
  const withReport = cutterImportErrorSchema.safeParse(payload);
  if (withReport.success) {
    return { report: withReport.data.report, refused: { code: withReport.data.error.code, message: withReport.data.error.message } };
  }
  const envelope = apiErrorSchema.safeParse(payload);
  if (envelope.success) {
    const { code, message, fields } = envelope.data.error;
    throw new ApiError(response.status, code, message, fields ?? {});
  }
  throw new ApiError(response.status, "bad_response", `The server answered ${response.status} without an explanation.`);
}

export function usePreviewCutterImport(shopId: string) {
  return useMutation({
    mutationFn: ({ file, fileName }: { file: Blob; fileName: string }) => importCutters(shopId, file, fileName, true),
  });
}

export function useImportCutters(shopId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ file, fileName }: { file: Blob; fileName: string }) => importCutters(shopId, file, fileName, false),
    onSuccess: (outcome) => {
      if (outcome.report.imported > 0) return queryClient.invalidateQueries({ queryKey: cuttersKey(shopId) });
    },
  });
}
