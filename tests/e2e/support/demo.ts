/**
 * What the e2e stack seeds (lib/cli/seed-demo.ts), written out here on purpose: the tests check
 * the app against these facts instead of reading them back from the code under test.
 */
import { E2E_BASE_URL } from "./ports";
export const DEMO_PASSWORD = "morphokin-demo";
export const DEMO_LAB = "Bracken Hill Patterning Lab";

export type DemoRole = "manager" | "scientist" | "modeller" | "collaborator";

export const DEMO: Record<DemoRole, { email: string; label: string }> = {
  manager: { email: "manager@brackenhill.example", label: "Lab manager" },
  scientist: { email: "scientist@brackenhill.example", label: "Bench scientist" },
  modeller: { email: "modeller@brackenhill.example", label: "Modeller" },
  collaborator: { email: "collaborator@brackenhill.example", label: "Collaborator" },
};

export const BASE_URL = E2E_BASE_URL;

/** A suffix that keeps names and addresses of one run apart from every other. */
export function unique(prefix: string): string {
  return `${prefix}-${Date.now().toString(36)}-${Math.random().toString(36).slice(2, 7)}`;
}

export function uniqueEmail(prefix: string): string {
  return `${unique(prefix)}@e2e.example`;
}
