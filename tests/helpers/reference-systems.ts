// The invented reference generator lives with the demo seed (seeds/invented-reference.ts); tests import it here too.
export * from '../../seeds/invented-reference';
