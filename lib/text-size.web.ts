// Web: type sizes in rem, so text follows the browser's default font size (a reader's
// setting) as well as page zoom. react-native-web passes string lengths through to CSS;
// React Native's types only know numbers, hence the cast.

const ROOT_PX = 16;

/** A type size from the scale, in the unit this platform scales with the reader's setting. */
export function textSize(px: number): number {
  return `${px / ROOT_PX}rem` as unknown as number;
}
