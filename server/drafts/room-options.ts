export interface CollabOptions {
  pingIntervalMs: number;
  /** Evaluation starts this long after the last change… */
  evaluationDelayMs: number;
  /** …but at most this long after the first change it has not covered yet (during a burst of edits). */
  evaluationMaxWaitMs: number;
  compactEvery: number;
  compactIntervalMs: number;
  /** Largest frame (and so Yjs update) a client may send; larger ones are refused. */
  maxFrameBytes: number;
}

export const DEFAULT_MAX_FRAME_BYTES = 1024 * 1024;

export const DEFAULT_COLLAB_OPTIONS: CollabOptions = {
  pingIntervalMs: 10_000,
  evaluationDelayMs: 40,
  evaluationMaxWaitMs: 100,
  compactEvery: 500,
  compactIntervalMs: 60_000,
  maxFrameBytes: DEFAULT_MAX_FRAME_BYTES,
};
