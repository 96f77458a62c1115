// The hostile-input scene (hostile-bodies.ts startProbeScene) for one vitest file, kept apart so the
// soak bench can import hostile-bodies.ts without vitest.
import { afterAll, beforeAll } from 'vitest';
import { startProbeScene, type ProbeScene } from './hostile-bodies';

/** A probe scene started before the file's tests and closed after; the fields are filled once `beforeAll` has run. */
export function probeSceneForSuite(): ProbeScene {
  const suite = {} as ProbeScene;
  beforeAll(async () => {
    Object.assign(suite, await startProbeScene());
  }, 60_000);
  afterAll(() => suite.close());
  return suite;
}
