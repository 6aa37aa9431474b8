// Web: the scene drawing is its own chunk, fetched after the brief has mounted.
import type * as SceneModule from './scene-svg';

export function loadSceneSvg(): Promise<typeof SceneModule> {
  return import('./scene-svg');
}
