/**
 * Imports every job handler module so that it registers itself. One line per module.
 */
import "server-only";
import "./echo-job";
import "../readouts/job";
import "../runs/job";
import "../fits/job";
