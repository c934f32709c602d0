import { memberPageSchema, memberSchema, type Role } from "@ringdown/contracts";
import { queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { shopApiPath } from "@/lib/active-shop";
import { apiRequest } from "@/lib/api-client";

/** Everything cached about one shop's team starts with this key. */
export function teamKey(shopId: string) {
  return ["shops", shopId, "team"] as const;
}

export const membersQueryOptions = (shopId: string) =>
  queryOptions({
    queryKey: [...teamKey(shopId), "members"] as const,
    // A shop's team fits one page; 200 is the largest page the API serves.
    queryFn: ({ signal }) => apiRequest(shopApiPath(shopId, "/members?pageSize=200"), { schema: memberPageSchema, signal }),
  });

export function useMembers(shopId: string) {
  return useQuery(membersQueryOptions(shopId));
}

export function useChangeRole(shopId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ userId, role }: { userId: string; role: Role }) =>
      apiRequest(shopApiPath(shopId, `/members/${encodeURIComponent(userId)}`), { method: "PATCH", body: { role }, schema: memberSchema }),
    onSettled: () => queryClient.invalidateQueries({ queryKey: teamKey(shopId) }),
  });
}

export function useRemoveMember(shopId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (userId: string) => apiRequest(shopApiPath(shopId, `/members/${encodeURIComponent(userId)}`), { method: "DELETE" }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: teamKey(shopId) }),
  });
}
