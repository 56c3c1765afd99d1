/**
 * Imports every job handler module so that it registers itself. One line per module.
 */
import "./echo-job";
import "./readout-job";
import "./simulation-job";
import "./fit-job";
