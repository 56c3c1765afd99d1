/** The ordered list of migrations. Add a new file here; never edit one that has shipped. */
import * as m0001 from "./20261201-0001-foundation";

export const migrationModules = [{ name: "20261201-0001-foundation", module: m0001 }];
