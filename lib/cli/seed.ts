/** `npm run seed`: the demo lab, if the database has no users yet (needs the fakes running). */
import { seedDemo } from "./seed-demo";

seedDemo()
  .then((seeded) => {
    process.stdout.write(seeded ? "seeded the demo lab\n" : "the database already has users; nothing seeded\n");
    process.exit(0);
  })
  .catch((err) => {
    process.stderr.write(`seeding failed: ${err instanceof Error ? err.message : err}\n`);
    process.exit(1);
  });
