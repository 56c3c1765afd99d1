/** Public API of the kinetics core: catalogue, custom-expression compiler, parameters, errors. */
export { CATALOGUE, getCatalogueKinetics, listCatalogueIds, type CatalogueKinetics } from "./catalogue";
export { compileKinetics, MAX_DERIVATIVE_NODES } from "./compile-kinetics";
export {
  KineticsDefinitionSchema,
  ParameterDefinitionSchema,
  MIN_SPECIES,
  MAX_SPECIES,
  MAX_PARAMETERS,
  type KineticsDefinition,
  type ParameterDefinition,
} from "./definition-schema";
export {
  KineticsAnalysisError,
  KineticsInputError,
  KineticsLimitError,
  KINETICS_ERROR_CODES,
  type KineticsErrorCode,
} from "./errors";
export { ALLOWED_FUNCTIONS, MAX_EXPRESSION_LENGTH, MAX_EXPRESSION_NODES, RESERVED_NAMES } from "./expression-compiler";
export { parameterIndex, parametersToRecord, resolveParameters } from "./parameters";
export { resolveKinetics, type KineticsSource } from "./resolve-kinetics";
export type { CompiledKinetics, KineticsUnits, ParameterSpec, PhysicalScales } from "./types";
