/**
 * Vitest setup for every test file: outside a Next request there is no cookie session, and
 * next-auth's getServerSession would throw reaching for request headers. Tests act through API
 * tokens; a request without one is "signed out".
 */
import { vi } from "vitest";

vi.mock("next-auth", async (original) => ({
  ...(await original<typeof import("next-auth")>()),
  getServerSession: async () => null,
}));
