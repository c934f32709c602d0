import { meSchema, type SignupBody } from "@ringdown/contracts";
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { apiRequest } from "@/lib/api-client";
import { meQueryKey } from "@/lib/query-client";

export function signUp(body: SignupBody) {
  return apiRequest("/auth/signup", { method: "POST", body, schema: meSchema });
}

/** Creates the person and their first shop (as its owner) and signs them in. */
export function useSignUp() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signUp,
    onSuccess: (me) => {
      queryClient.removeQueries({ predicate: (q) => q.queryKey[0] !== meQueryKey[0] });
      queryClient.setQueryData(meQueryKey, me);
    },
  });
}
