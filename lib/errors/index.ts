/** The core's shared error base and the "field: message" helper; framework-free. */
export { CoreError, isCoreError, type CoreErrorFamily } from "./core-error";
export { prefixField, startsWithField } from "./field-message";
