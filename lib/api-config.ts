// Where the API lives, read once. The Express server serves both the web build and /api, so
// on the web the paths are relative to the page's origin; a native build sets
// EXPO_PUBLIC_API_BASE_URL (Expo inlines EXPO_PUBLIC_* variables at build time).
export const API_BASE_URL: string = process.env.EXPO_PUBLIC_API_BASE_URL ?? '';

/** The full address of a server path such as `/api/briefs/region.pdf`. */
export function serverUrl(path: string): string {
  return `${API_BASE_URL}${path}`;
}
