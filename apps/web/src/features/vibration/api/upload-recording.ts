import { apiErrorSchema, recordingAcceptedSchema, type RecordingSummary } from "@ringdown/contracts";
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { ApiError } from "@/lib/api-client";
import { machineApiPath, vibrationKey } from "./keys";

export interface UploadFields {
  kind: "cut" | "tap" | "spindle_free" | "frf";
  rpm?: number | undefined;
  flutes?: number | undefined;
  direction?: "x" | "y" | "z" | undefined;
  dialSetting?: string | undefined;
  note?: string | undefined;
}

export interface UploadProgress {
  loadedBytes: number;
  totalBytes: number;
}

/**
 * POST …/recordings as multipart with the file in `file`. XMLHttpRequest rather than fetch: only
 * it reports how much of the body has gone out, which a phone on shop Wi-Fi needs to see.
 * Rejects with an ApiError in the shape `apiRequest` uses (field errors included).
 */
export function uploadRecording(
  shopId: string,
  machineId: string,
  file: Blob,
  fileName: string,
  fields: UploadFields,
  options: { onProgress?: (progress: UploadProgress) => void; signal?: AbortSignal } = {},
): Promise<RecordingSummary> {
  const form = new FormData();
  form.set("kind", fields.kind);
  for (const key of ["rpm", "flutes", "direction", "dialSetting", "note"] as const) {
    const value = fields[key];
    if (value !== undefined && value !== "") form.set(key, String(value));
  }
  form.set("file", file, fileName);

  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open("POST", `/api${machineApiPath(shopId, machineId, "/recordings")}`);
    xhr.setRequestHeader("Accept", "application/json");
    xhr.withCredentials = true;
    xhr.upload.onprogress = (event) => {
      options.onProgress?.({ loadedBytes: event.loaded, totalBytes: event.lengthComputable ? event.total : file.size });
    };
    xhr.onerror = () => reject(new ApiError(0, "network_error", "Cannot reach the Ringdown server. Check the connection and try again; nothing was stored."));
    xhr.onabort = () => reject(new DOMException("The upload was cancelled.", "AbortError"));
    xhr.onload = () => {
      let payload: unknown;
      try {
        payload = xhr.responseText ? JSON.parse(xhr.responseText) : undefined;
      } catch {
        payload = undefined;
      }
      if (xhr.status >= 200 && xhr.status < 300) {
        const parsed = recordingAcceptedSchema.safeParse(payload);
        if (parsed.success) resolve(parsed.data.recording);
        else reject(new ApiError(xhr.status, "bad_response", "The server's answer did not have the expected shape. Reload the page; if it persists, report it."));
        return;
      }
      const envelope = apiErrorSchema.safeParse(payload);
      if (envelope.success) {
        const { code, message, fields: errors } = envelope.data.error;
        reject(new ApiError(xhr.status, code, message, errors ?? {}));
      } else {
        reject(
          new ApiError(
            xhr.status,
            xhr.status === 413 ? "payload_too_large" : "bad_response",
            xhr.status === 413 ? "The recording is too large for the server." : `The server answered ${xhr.status} without an explanation.`,
          ),
        );
      }
    };
    if (options.signal) {
      if (options.signal.aborted) {
        reject(new DOMException("The upload was cancelled.", "AbortError"));
        return;
      }
      options.signal.addEventListener("abort", () => xhr.abort(), { once: true });
    }
    xhr.send(form);
  });
}

export function useUploadRecording(shopId: string, machineId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: { file: Blob; fileName: string; fields: UploadFields; onProgress?: (p: UploadProgress) => void; signal?: AbortSignal }) =>
      uploadRecording(shopId, machineId, input.file, input.fileName, input.fields, {
        ...(input.onProgress ? { onProgress: input.onProgress } : {}),
        ...(input.signal ? { signal: input.signal } : {}),
      }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: [...vibrationKey(shopId, machineId), "recordings"] }),
  });
}
