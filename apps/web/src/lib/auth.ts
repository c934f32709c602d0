import { meSchema, type Me, type Membership, type UnitSystem } from "@ringdown/contracts";
import { queryOptions, useMutation, useQuery } from "@tanstack/react-query";
import { apiRequest, isApiError } from "./api-client";
import { meQueryKey } from "./query-client";

/**
 * The signed-in person, their shops and the active shop; `null` when nobody is
 * signed in (the API answers 401). Shared by the route guard and every feature.
 */
export async function getMe(signal?: AbortSignal): Promise<Me | null> {
  try {
    return await apiRequest("/me", { schema: meSchema, signal });
  } catch (error) {
    if (isApiError(error) && error.isUnauthenticated) return null;
    throw error;
  }
}

export const meQueryOptions = () =>
  queryOptions({
    queryKey: meQueryKey,
    queryFn: ({ signal }) => getMe(signal),
    staleTime: 60_000,
  });

export function useMe() {
  return useQuery(meQueryOptions());
}

/** The membership of the active shop, or undefined when there is none. */
export function activeMembership(me: Me): Membership | undefined {
  return me.memberships.find((m) => m.shopId === me.activeShopId);
}

/** The person's display preference; metric until the person is known. */
export function useUnitSystem(): UnitSystem {
  const { data } = useMe();
  return data?.user.unitSystem ?? "metric";
}

export function logout(): Promise<undefined> {
  return apiRequest("/auth/logout", { method: "POST" });
}

/**
 * Ends the session, then loads the sign-in page afresh: a full page load drops
 * everything the previous person had in memory, not just the query cache.
 */
export function useLogout() {
  return useMutation({
    mutationFn: logout,
    onSuccess: () => {
      window.location.replace("/sign-in");
    },
  });
}
