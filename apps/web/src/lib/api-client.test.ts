import { meSchema } from "@ringdown/contracts";
import { afterEach, describe, expect, it, vi } from "vitest";
import { ApiError, apiRequest } from "./api-client";

function respond(status: number, body: unknown, statusText = "") {
  const text = body === undefined ? "" : typeof body === "string" ? body : JSON.stringify(body);
  const fetchMock = vi.fn(async (_url: string, _init?: RequestInit) => new Response(status === 204 ? null : text, { status, statusText }));
  vi.stubGlobal("fetch", fetchMock);
  return fetchMock;
}

afterEach(() => {
  vi.unstubAllGlobals();
});

const me = {
  user: { id: "0b9a2f4e-6d1c-4c1e-9a5a-3f1d2e4b5c6d", email: "a@example.test", name: "A", unitSystem: "metric" },
  memberships: [],
  activeShopId: null,
};

describe("apiRequest", () => {
  it("sends JSON to /api with the session cookie and parses the answer with its schema", async () => {
    const fetchMock = respond(200, me);
    const result = await apiRequest("/auth/login", { method: "POST", body: { email: "a@example.test" }, schema: meSchema });
    expect(result).toEqual(me);
    const [url, init] = fetchMock.mock.calls[0]!;
    expect(url).toBe("/api/auth/login");
    expect(init?.method).toBe("POST");
    expect(init?.credentials).toBe("same-origin");
    expect(new Headers(init?.headers).get("Content-Type")).toBe("application/json");
    expect(init?.body).toBe(JSON.stringify({ email: "a@example.test" }));
  });

  it("sends FormData as multipart, leaving the boundary header to the browser", async () => {
    const fetchMock = respond(201, { ok: true });
    const form = new FormData();
    form.set("note", "ran clean");
    await apiRequest("/shops/x/recipes/y/cut-logs", { method: "POST", body: form });
    const [, init] = fetchMock.mock.calls[0]!;
    expect(init?.body).toBe(form);
    expect(new Headers(init?.headers).has("Content-Type")).toBe(false);
  });

  it("turns the error envelope into an ApiError with field errors", async () => {
    respond(400, {
      error: { code: "validation_failed", message: "Check the highlighted fields.", fields: { password: "Use at least 10 characters" } },
    });
    const error = await apiRequest("/auth/signup", { method: "POST", body: {} }).catch((e: unknown) => e);
    expect(error).toBeInstanceOf(ApiError);
    expect(error).toMatchObject({
      status: 400,
      code: "validation_failed",
      message: "Check the highlighted fields.",
      fields: { password: "Use at least 10 characters" },
    });
  });

  it("explains a failure that has no envelope", async () => {
    respond(502, "<html>Bad gateway</html>", "Bad Gateway");
    const error = await apiRequest("/me").catch((e: unknown) => e);
    expect(error).toMatchObject({ status: 502, code: "bad_response" });
    expect((error as ApiError).message).toMatch(/not answering/);
  });

  it("reports an unreachable server as a network error", async () => {
    vi.stubGlobal("fetch", vi.fn(async () => Promise.reject(new TypeError("Failed to fetch"))));
    const error = await apiRequest("/me").catch((e: unknown) => e);
    expect(error).toMatchObject({ status: 0, code: "network_error" });
  });

  it("refuses an answer that does not match the contract", async () => {
    respond(200, { user: { id: "not-a-uuid" } });
    const error = await apiRequest("/me", { schema: meSchema }).catch((e: unknown) => e);
    expect(error).toMatchObject({ code: "bad_response" });
  });

  it("resolves undefined for 204 No Content", async () => {
    respond(204, undefined);
    await expect(apiRequest("/auth/logout", { method: "POST" })).resolves.toBeUndefined();
  });
});
