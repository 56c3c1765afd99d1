export type { GreyImage } from "./grey-image";
export { ImagingError, IMAGING_ERROR_CODES, type ImagingErrorCode } from "./errors";
export { encodePng, encodeTiff16, type EncodePngOptions, type EncodeTiffOptions } from "./encode";
export { decodeImage, MAX_DECODE_PIXELS, type DecodeOptions, type DecodedImage, type DecodedInfo } from "./decode";
export { sniffFileKind, type FileKind } from "./sniff-file-kind";
export { readPixelSize, readOmePixelSize, type PixelSizeInfo, type PixelSizeSource } from "./pixel-size";
