/** The ordered list of migrations. Add a new file here; never edit one that has shipped. */
import * as m0001 from "./20261201-0001-foundation";
import * as m0002 from "./20261201-0002-kinetics-jobs-readouts";
import * as m0005 from "./20261201-0005-discussions";
import * as m0006 from "./20261201-0006-fits";
import * as m0007 from "./20261201-0007-simulation-runs";
import * as m0010auth from "./20261203-0010-rate-limits-signup-requests";
import * as m0020 from "./20261203-0020-upload-state";
import * as m0030 from "./20261203-0030-job-restarts-token-expiry-account-events";
import * as m0200jobs from "./20261203-0200-job-workers";
import * as m1200layout from "./20261203-1200-upload-image-layout";
import * as m1400batches from "./20261203-1400-batches";
import * as m1820changed from "./20261203-1820-changed-from";
import * as m1830links from "./20261203-1830-account-links";
import * as m2330summaries from "./20261204-2330-list-summaries";
import * as m2130counts from "./20261205-2130-change-counts";

export const migrationModules = [
  { name: "20261201-0001-foundation", module: m0001 },
  { name: "20261201-0002-kinetics-jobs-readouts", module: m0002 },
  { name: "20261201-0005-discussions", module: m0005 },
  { name: "20261201-0006-fits", module: m0006 },
  { name: "20261201-0007-simulation-runs", module: m0007 },
  { name: "20261203-0010-rate-limits-signup-requests", module: m0010auth },
  { name: "20261203-0020-upload-state", module: m0020 },
  { name: "20261203-0030-job-restarts-token-expiry-account-events", module: m0030 },
  { name: "20261203-0200-job-workers", module: m0200jobs },
  { name: "20261203-1200-upload-image-layout", module: m1200layout },
  { name: "20261203-1400-batches", module: m1400batches },
  { name: "20261203-1820-changed-from", module: m1820changed },
  { name: "20261203-1830-account-links", module: m1830links },
  { name: "20261204-2330-list-summaries", module: m2330summaries },
  { name: "20261205-2130-change-counts", module: m2130counts },
];
