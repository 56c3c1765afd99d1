declare module "fft-js" {
  /** Reference radix-2 FFT (Vail Systems); input reals or [re, im] pairs, output [re, im] pairs. */
  export function fft(vector: number[] | [number, number][]): [number, number][];
  export function ifft(vector: [number, number][]): [number, number][];
}
