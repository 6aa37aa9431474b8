// Native: expo-document-picker copies the file into the app's cache and gives its URI;
// React Native's FormData sends a { uri, name, type } part from that file.
import * as DocumentPicker from 'expo-document-picker';

import { CSV_TYPES, type PickedFile } from './pick-file.types';

export type { PickedFile } from './pick-file.types';

/** Opens the system picker for one CSV file; null when the person cancels. */
export async function pickCsvFile(): Promise<PickedFile | null> {
  const result = await DocumentPicker.getDocumentAsync({
    type: CSV_TYPES,
    copyToCacheDirectory: true,
    multiple: false,
  });
  if (result.canceled || !result.assets?.length) return null;
  const asset = result.assets[0];
  return {
    name: asset.name,
    size: asset.size ?? null,
    appendTo(form, field) {
      // React Native's FormData takes this part shape; the DOM typing does not know it.
      form.append(field, { uri: asset.uri, name: asset.name, type: asset.mimeType ?? 'text/csv' } as unknown as Blob);
    },
  };
}
