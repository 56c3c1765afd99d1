/**
 * The browser tests' ports on 127.0.0.1. E2E_PORT_OFFSET (default 0) moves all four together, so
 * two checkouts on one machine can run their browser tests side by side.
 */
const offset = Number(process.env.E2E_PORT_OFFSET ?? "0") || 0;

export const E2E_PORTS = {
  app: 3100 + offset,
  s3: 4570 + offset,
  smtp: 2527 + offset,
  mailbox: 2528 + offset,
} as const;
export const E2E_BASE_URL = `http://127.0.0.1:${E2E_PORTS.app}`;
export const E2E_MAILBOX_URL = `http://127.0.0.1:${E2E_PORTS.mailbox}`;
