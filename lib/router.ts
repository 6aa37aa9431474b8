/**
 * The parts of Expo Router the app uses, imported from the modules that define them.
 *
 * `expo-router`'s package index re-exports every layout it ships (tabs, stacks, their
 * React Navigation parts); Metro keeps every module a file requires, so importing the
 * index put layouts the app never renders into the first bundle every visitor downloads.
 * The app's screens import routing from here instead (see bench:bundle).
 */
export { useGlobalSearchParams, useLocalSearchParams, usePathname, useRouter } from 'expo-router/build/hooks';
export { router } from 'expo-router/build/imperative-api';
export { Link } from 'expo-router/build/link/Link';
export { Slot } from 'expo-router/build/views/Navigator';
export type { Href } from 'expo-router/build/typed-routes/types';
export type { ErrorBoundaryProps } from 'expo-router/build/views/Try';
