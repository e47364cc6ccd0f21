// apca-w3 ships no type declarations; only the two functions we call are declared.
declare module 'apca-w3' {
  export function APCAcontrast(textY: number, backgroundY: number, places?: number): number | string;
  export function sRGBtoY(rgb: readonly number[]): number;
}
