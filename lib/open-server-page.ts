// Native: server pages (the sign-in flow) open in the system browser.
import { Linking } from 'react-native';

import { serverUrl } from './api-config';

/** Leave the app for a page the server renders itself, e.g. `/api/auth/stand-in`. */
export function openServerPage(path: string): void {
  void Linking.openURL(serverUrl(path));
}
