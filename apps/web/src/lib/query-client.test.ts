import { describe, expect, it } from "vitest";
import { ApiError } from "./api-client";
import { createQueryClient, meQueryKey } from "./query-client";

const me = { user: { id: "u", email: "a@example.test", name: "A", unitSystem: "metric" }, memberships: [], activeShopId: null };

describe("createQueryClient", () => {
  it("forgets the signed-in person when any query answers 401", async () => {
    const client = createQueryClient();
    client.setQueryData(meQueryKey, me);
    await client
      .fetchQuery({
        queryKey: ["shops", "s1", "machines"],
        queryFn: () => Promise.reject(new ApiError(401, "unauthenticated", "Your session has ended. Sign in again.")),
      })
      .catch(() => undefined);
    expect(client.getQueryData(meQueryKey)).toBeNull();
  });

  it("keeps the person for other errors", async () => {
    const client = createQueryClient();
    client.setQueryData(meQueryKey, me);
    await client
      .fetchQuery({ queryKey: ["shops", "s1", "x"], queryFn: () => Promise.reject(new ApiError(404, "not_found", "Not found.")) })
      .catch(() => undefined);
    expect(client.getQueryData(meQueryKey)).toEqual(me);
  });

  it("does not retry client errors", async () => {
    const client = createQueryClient();
    let calls = 0;
    await client
      .fetchQuery({
        queryKey: ["x"],
        queryFn: () => {
          calls += 1;
          return Promise.reject(new ApiError(403, "forbidden", "Owners only."));
        },
        retry: client.getDefaultOptions().queries?.retry,
      })
      .catch(() => undefined);
    expect(calls).toBe(1);
  });
});
