// The caution every stream output carries beside the general one (our own wording).

export const STREAM_CAUTION =
  'Tidal streams vary across a channel and with depth, and wind, waves and river flow change their rates, '
  + 'directions and the times of slack water, sometimes by a great deal; rates near the shore and in '
  + 'eddies differ from those predicted here.';
