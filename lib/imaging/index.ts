export type { GreyImage } from "./grey-image";
export { ImagingError, IMAGING_ERROR_CODES, type ImagingErrorCode } from "./errors";
export { encodePng, encodeTiff16, type EncodePngOptions, type EncodeTiffOptions } from "./encode";
export {
  decodeImage,
  MAX_DECODE_PIXELS,
  MAX_FULL_RESOLUTION_PIXELS,
  type DecodeOptions,
  type DecodedImage,
  type DecodedInfo,
} from "./decode";
export type { PixelRegion } from "./read-page-pixels";
export { readImageLayout, type ImageLayout } from "./read-image-layout";
export { checkStackChoice, pageOf, type StackLayout, type StackChoice } from "./stack-layout";
export { sniffFileKind, type FileKind } from "./sniff-file-kind";
export { readPixelSize, readOmePixelSize, type PixelSizeInfo, type PixelSizeSource } from "./pixel-size";
export { isImageFile, type ImageFile, type ImageInput } from "./image-input";
