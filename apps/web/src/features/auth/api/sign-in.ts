import { meSchema, type LoginBody } from "@ringdown/contracts";
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { apiRequest } from "@/lib/api-client";
import { meQueryKey } from "@/lib/query-client";

export function signIn(body: LoginBody) {
  return apiRequest("/auth/login", { method: "POST", body, schema: meSchema });
}

/** Signs in; the answer is the signed-in person, cached as `me`. */
export function useSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signIn,
    onSuccess: (me) => {
      // Nothing cached for a previous person may leak into this session.
      queryClient.removeQueries({ predicate: (q) => q.queryKey[0] !== meQueryKey[0] });
      queryClient.setQueryData(meQueryKey, me);
    },
  });
}
