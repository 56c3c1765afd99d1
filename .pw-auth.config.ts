// Local, uncommitted: the shared config with a longer web-server start on a loaded machine.
import base from "./playwright.config";
export default { ...base, webServer: { ...(base.webServer as object), timeout: 400_000 } };
