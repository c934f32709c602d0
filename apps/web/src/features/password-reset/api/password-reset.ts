import { meSchema, passwordResetLinkSchema, passwordResetRequestedSchema } from "@ringdown/contracts";
import { queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { apiRequest } from "@/lib/api-client";
import { meQueryKey } from "@/lib/query-client";

export function useRequestPasswordReset() {
  return useMutation({
    mutationFn: (email: string) =>
      apiRequest("/auth/password-reset", { method: "POST", body: { email }, schema: passwordResetRequestedSchema }),
  });
}

export const resetLinkQueryOptions = (token: string) =>
  queryOptions({
    queryKey: ["password-reset", token] as const,
    queryFn: ({ signal }) => apiRequest(`/auth/password-reset/${encodeURIComponent(token)}`, { schema: passwordResetLinkSchema, signal }),
    staleTime: 0,
  });

export function useResetLink(token: string) {
  return useQuery(resetLinkQueryOptions(token));
}

/** Sets the new password; the answer is the person, signed in afresh (other sessions ended). */
export function useResetPassword(token: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (password: string) =>
      apiRequest(`/auth/password-reset/${encodeURIComponent(token)}`, { method: "POST", body: { password }, schema: meSchema }),
    onSuccess: (me) => {
      queryClient.removeQueries({ predicate: (q) => q.queryKey[0] !== meQueryKey[0] });
      queryClient.setQueryData(meQueryKey, me);
    },
  });
}
