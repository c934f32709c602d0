import {
  acceptDialRpmResponseSchema,
  acceptModeResponseSchema,
  recordingDetailSchema,
  recordingListSchema,
  type RecordingDetail,
} from "@ringdown/contracts";
import { queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { shopApiPath } from "@/lib/active-shop";
import { apiRequest } from "@/lib/api-client";
import { invalidateAfterProfileChange, machineApiPath, vibrationKey } from "./keys";

/** How often a recording under analysis is asked for its status [ms]. */
export const POLL_INTERVAL_MS = 1000;

const recordingsKey = (shopId: string, machineId: string) => [...vibrationKey(shopId, machineId), "recordings"] as const;

export function getRecordings(shopId: string, machineId: string, signal?: AbortSignal) {
  return apiRequest(machineApiPath(shopId, machineId, "/recordings"), { schema: recordingListSchema, signal });
}

/** The list polls while any recording is still queued or being analysed. */
export const recordingsQueryOptions = (shopId: string, machineId: string) =>
  queryOptions({
    queryKey: [...recordingsKey(shopId, machineId), "list"] as const,
    enabled: shopId !== "",
    queryFn: ({ signal }) => getRecordings(shopId, machineId, signal),
    refetchInterval: (query) =>
      query.state.data?.items.some((r) => r.status === "queued" || r.status === "analysing") ? POLL_INTERVAL_MS * 2 : false,
  });

export const useRecordings = (shopId: string, machineId: string) => useQuery(recordingsQueryOptions(shopId, machineId));

export function getRecording(shopId: string, machineId: string, recordingId: string, signal?: AbortSignal) {
  return apiRequest(machineApiPath(shopId, machineId, `/recordings/${encodeURIComponent(recordingId)}`), { schema: recordingDetailSchema, signal });
}

export function isSettled(recording: Pick<RecordingDetail, "status"> | undefined): boolean {
  return recording?.status === "done" || recording?.status === "failed";
}

/** One recording with its results; asks again every second until the analysis is done or failed. */
export const recordingQueryOptions = (shopId: string, machineId: string, recordingId: string) =>
  queryOptions({
    queryKey: [...recordingsKey(shopId, machineId), "one", recordingId] as const,
    enabled: shopId !== "" && recordingId !== "",
    queryFn: ({ signal }) => getRecording(shopId, machineId, recordingId, signal),
    refetchInterval: (query) => (query.state.error || isSettled(query.state.data) ? false : POLL_INTERVAL_MS),
    // Results do not change once the analysis settled.
    staleTime: (query) => (isSettled(query.state.data) ? Number.POSITIVE_INFINITY : 0),
  });

export const useRecording = (shopId: string, machineId: string, recordingId: string) => useQuery(recordingQueryOptions(shopId, machineId, recordingId));

/** Address of the stored file, for downloading it as uploaded. */
export function recordingFileUrl(shopId: string, machineId: string, recordingId: string): string {
  return `/api${machineApiPath(shopId, machineId, `/recordings/${encodeURIComponent(recordingId)}/file`)}`;
}

export function deleteRecording(shopId: string, machineId: string, recordingId: string) {
  return apiRequest(machineApiPath(shopId, machineId, `/recordings/${encodeURIComponent(recordingId)}`), { method: "DELETE" });
}

export function useDeleteRecording(shopId: string, machineId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (recordingId: string) => deleteRecording(shopId, machineId, recordingId),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: recordingsKey(shopId, machineId) }),
  });
}

export function acceptMode(shopId: string, recordingId: string, body: { direction?: "x" | "y" | "z"; note?: string } = {}) {
  return apiRequest(shopApiPath(shopId, `/recordings/${encodeURIComponent(recordingId)}/accept-mode`), { method: "POST", body, schema: acceptModeResponseSchema });
}

/** Adds the tap-test or fitted mode of a recording to the machine's modes. */
export function useAcceptMode(shopId: string, machineId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ recordingId, body }: { recordingId: string; body?: { direction?: "x" | "y" | "z"; note?: string } }) =>
      acceptMode(shopId, recordingId, body),
    onSuccess: (result) => invalidateAfterProfileChange(queryClient, shopId, machineId, result.recipesFlagged),
  });
}

export function acceptDialRpm(shopId: string, recordingId: string, dialSetting?: string) {
  return apiRequest(shopApiPath(shopId, `/recordings/${encodeURIComponent(recordingId)}/accept-dial-rpm`), {
    method: "POST",
    body: dialSetting ? { dialSetting } : {},
    schema: acceptDialRpmResponseSchema,
  });
}

/** Sets a dial setting's rpm to the speed measured with the spindle running free. */
export function useAcceptDialRpm(shopId: string, machineId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ recordingId, dialSetting }: { recordingId: string; dialSetting?: string }) => acceptDialRpm(shopId, recordingId, dialSetting),
    onSuccess: () => invalidateAfterProfileChange(queryClient, shopId, machineId),
  });
}
