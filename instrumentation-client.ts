/**
 * Runs in the browser before the app's own code (Next's instrumentation-client convention).
 * zod probes whether it may compile parsers with `new Function`; under the pages' CSP (no
 * 'unsafe-eval') that probe is reported as a violation. Jitless mode never probes, and parses the
 * same way, interpreted.
 */
import { z } from "zod";

z.config({ jitless: true });
