/**
 * A local SMTP server that files each message as JSON in a folder, plus a small HTTP listing
 * (GET /messages, newest first) that the app's development mailbox page and the browser tests read.
 */
import { mkdirSync, readdirSync, readFileSync, writeFileSync } from "node:fs";
import http from "node:http";
import path from "node:path";
import { simpleParser } from "mailparser";
import { SMTPServer } from "smtp-server";

export interface FiledMessage {
  id: string;
  receivedAt: string;
  from: string | undefined;
  to: string[];
  subject: string | undefined;
  text: string | undefined;
  html: string | undefined;
}

export function listMessages(dir: string): FiledMessage[] {
  return readdirSync(dir)
    .filter((f) => f.endsWith(".json"))
    .sort()
    .reverse()
    .map((f) => JSON.parse(readFileSync(path.join(dir, f), "utf8")) as FiledMessage);
}

export async function startFakeSmtp(options: { smtpPort: number; httpPort: number; directory: string }) {
  mkdirSync(options.directory, { recursive: true });
  let counter = 0;
  const smtp = new SMTPServer({
    authOptional: true,
    disabledCommands: ["STARTTLS"],
    logger: false,
    onData(stream, session, callback) {
      simpleParser(stream)
        .then((m) => {
          const receivedAt = new Date();
          const id = `${receivedAt.getTime()}-${String(++counter).padStart(4, "0")}`;
          const to = (session.envelope.rcptTo ?? []).map((r) => r.address);
          const msg: FiledMessage = {
            id,
            receivedAt: receivedAt.toISOString(),
            from: m.from?.text,
            to,
            subject: m.subject,
            text: m.text,
            html: typeof m.html === "string" ? m.html : undefined,
          };
          writeFileSync(path.join(options.directory, `${id}.json`), JSON.stringify(msg, null, 2));
          callback();
        })
        .catch(callback);
    },
  });
  await new Promise<void>((resolve, reject) => {
    smtp.once("error", reject);
    smtp.listen(options.smtpPort, "127.0.0.1", () => resolve());
  });
  const web = http.createServer((req, res) => {
    const url = new URL(req.url ?? "/", "http://127.0.0.1");
    if (req.method === "GET" && url.pathname === "/messages") {
      let messages = listMessages(options.directory);
      const to = url.searchParams.get("to");
      if (to) messages = messages.filter((m) => m.to.some((t) => t.toLowerCase() === to.toLowerCase()));
      res.writeHead(200, { "content-type": "application/json" });
      res.end(JSON.stringify({ messages }));
      return;
    }
    res.writeHead(404, { "content-type": "application/json" });
    res.end(JSON.stringify({ error: "not found" }));
  });
  try {
    await new Promise<void>((resolve, reject) => {
      web.once("error", reject);
      web.listen(options.httpPort, "127.0.0.1", () => resolve());
    });
  } catch (err) {
    // The mail listing's port was taken: leave nothing listening behind the refusal.
    await new Promise<void>((r) => smtp.close(() => r()));
    throw err;
  }
  return {
    close: async () => {
      await new Promise<void>((r) => smtp.close(() => r()));
      await new Promise<void>((r) => web.close(() => r()));
    },
  };
}
