/**
 * A child process that sends one upload through the real upload route handler and is meant to be
 * killed (SIGKILL) half-way by tests/api/uploads-crash.test.ts. Configuration comes from the
 * environment exactly as for the server (DATABASE_URL or DATABASE_PATH, MORPHOKIN_DATA_DIR, S3_*).
 *
 *   tsx tests/support/upload-child.ts <mode> <labId> <specimenId> <token> <bytes>
 *
 * mode `slow-body`: the request body arrives slowly and never ends (killed while formidable
 *   writes the temporary file);
 * mode `slow-put`: the body arrives at once, the put into object storage is slowed down and its
 *   progress printed as `put-bytes <n>` lines (killed while the object is half-stored).
 */
import { Readable, Transform } from "node:stream";
import { services } from "@/lib/server/services";
import { POST } from "@/app/api/v1/labs/[labId]/specimens/[specimenId]/uploads/route";

const [mode, labId, specimenId, token, bytesArg] = process.argv.slice(2);
const size = Number(bytesArg);
const boundary = "----morphokin-crash-test";
const head = new TextEncoder().encode(
  `--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="rows.csv"\r\nContent-Type: text/csv\r\n\r\n`,
);
const tail = new TextEncoder().encode(`\r\n--${boundary}--\r\n`);
/** A CSV table of `n` bytes: a header line, then rows of two numbers. */
const csvOf = (n: number) => {
  const row = "12.5,34.25\n";
  return new TextEncoder().encode(("x,y\n" + row.repeat(Math.ceil(n / row.length))).slice(0, n - 1) + "\n");
};
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

function slowBody(): ReadableStream<Uint8Array> {
  const chunk = csvOf(16 * 1024);
  let sent = 0;
  return new ReadableStream({
    async pull(controller) {
      if (sent === 0) controller.enqueue(head);
      await sleep(50);
      controller.enqueue(sent === 0 ? chunk : chunk.subarray(4)); // header line once
      sent += chunk.length;
    },
  });
}

function throttleStore() {
  const store = services().store;
  const put = store.put.bind(store);
  store.put = (key, body, options) => {
    let n = 0;
    const slow = new Transform({
      transform(chunk: Buffer, _enc, done) {
        void (async () => {
          for (let i = 0; i < chunk.length; i += 16 * 1024) {
            await sleep(40);
            n += Math.min(16 * 1024, chunk.length - i);
            process.stdout.write(`put-bytes ${n}\n`);
          }
          done(null, chunk);
        })();
      },
    });
    return put(key, (body as Readable).pipe(slow), options);
  };
}

async function main() {
  let body: ReadableStream<Uint8Array>;
  if (mode === "slow-body") {
    body = slowBody();
  } else {
    throttleStore();
    body = Readable.toWeb(Readable.from([head, csvOf(size), tail])) as ReadableStream<Uint8Array>;
  }
  const request = new Request(`http://127.0.0.1:3999/api/v1/labs/${labId}/specimens/${specimenId}/uploads`, {
    method: "POST",
    headers: { authorization: `Bearer ${token}`, "content-type": `multipart/form-data; boundary=${boundary}` },
    body,
    duplex: "half",
  } as RequestInit);
  process.stdout.write("sending\n");
  const res = await POST(request, { params: Promise.resolve({ labId, specimenId }) });
  process.stdout.write(`answered ${res.status} ${await res.text()}\n`);
  process.exit(0);
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
