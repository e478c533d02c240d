// Bead colours live in src/shared/drawing/palette.ts (the exports use them too); presence colours in
// src/shared/presence-colour.ts (the server stamps them on every relayed presence).
export { BEAD_COLOURS, beadColour } from '../../../shared/drawing/palette';
