/** Device positions of one group, in metres, as columns (index = device index within the group). */
export interface Positions {
  readonly x: Float64Array;
  readonly y: Float64Array;
}
