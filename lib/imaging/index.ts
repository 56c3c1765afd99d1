export type { GreyImage } from "./grey-image";
export { ImagingError, type ImagingErrorCode } from "./errors";
export { encodePng, encodeTiff16, type EncodePngOptions, type EncodeTiffOptions } from "./encode";
