// Native: the scene drawing loads with the app bundle; the promise keeps one contract with
// the web file, where it is a chunk of its own.
import type * as SceneModule from './scene-svg';

export function loadSceneSvg(): Promise<typeof SceneModule> {
  return Promise.resolve(require('./scene-svg') as typeof SceneModule);
}
