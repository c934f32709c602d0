import { invitationPreviewSchema, meSchema, type AcceptInvitationBody } from "@ringdown/contracts";
import { queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { apiRequest } from "@/lib/api-client";
import { meQueryKey } from "@/lib/query-client";

export const invitationQueryOptions = (token: string) =>
  queryOptions({
    queryKey: ["invitation", token] as const,
    queryFn: ({ signal }) => apiRequest(`/invitations/${encodeURIComponent(token)}`, { schema: invitationPreviewSchema, signal }),
    staleTime: 0,
  });

export function useInvitationPreview(token: string) {
  return useQuery(invitationQueryOptions(token));
}

/** Accepts: the answer is the (possibly new, now signed-in) person with the new shop active. */
export function useAcceptInvitation(token: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: AcceptInvitationBody) =>
      apiRequest(`/invitations/${encodeURIComponent(token)}`, { method: "POST", body, schema: meSchema }),
    onSuccess: (me) => {
      queryClient.removeQueries({ predicate: (q) => q.queryKey[0] !== meQueryKey[0] });
      queryClient.setQueryData(meQueryKey, me);
    },
  });
}
