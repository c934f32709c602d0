import { invitationListSchema, invitationSchema, type CreateInvitationBody } from "@ringdown/contracts";
import { queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { shopApiPath } from "@/lib/active-shop";
import { apiRequest } from "@/lib/api-client";
import { teamKey } from "./members";

export const invitationsQueryOptions = (shopId: string) =>
  queryOptions({
    queryKey: [...teamKey(shopId), "invitations"] as const,
    queryFn: ({ signal }) => apiRequest(shopApiPath(shopId, "/invitations"), { schema: invitationListSchema, signal }),
  });

export function useInvitations(shopId: string, enabled: boolean) {
  return useQuery({ ...invitationsQueryOptions(shopId), enabled });
}

export function useInvite(shopId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: CreateInvitationBody) => apiRequest(shopApiPath(shopId, "/invitations"), { method: "POST", body, schema: invitationSchema }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: teamKey(shopId) }),
  });
}

export function useResendInvitation(shopId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: string) =>
      apiRequest(shopApiPath(shopId, `/invitations/${encodeURIComponent(id)}/resend`), { method: "POST", schema: invitationSchema }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: teamKey(shopId) }),
  });
}

export function useRevokeInvitation(shopId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: string) => apiRequest(shopApiPath(shopId, `/invitations/${encodeURIComponent(id)}`), { method: "DELETE" }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: teamKey(shopId) }),
  });
}
