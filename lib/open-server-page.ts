// Native: server pages (the sign-in flow) open in the system browser.
import { Linking } from 'react-native';

const BASE_URL = process.env.EXPO_PUBLIC_API_BASE_URL ?? '';

/** Leave the app for a page the server renders itself, e.g. `/api/auth/stand-in`. */
export function openServerPage(path: string): void {
  void Linking.openURL(`${BASE_URL}${path}`);
}
