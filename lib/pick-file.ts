// Native: expo-document-picker copies the file into the app's cache and gives its URI;
// React Native's FormData sends a { uri, name, type } part from that file.
import * as DocumentPicker from 'expo-document-picker';

import { CSV_TYPES, GEOJSON_TYPES, type PickedFile } from './pick-file.types';

export type { PickedFile } from './pick-file.types';

/** Opens the system picker for one CSV file; null when the person cancels. */
export function pickCsvFile(): Promise<PickedFile | null> {
  return pickOneFile(CSV_TYPES, 'text/csv');
}

/** Opens the system picker for one GeoJSON file (district boundaries); null when the person cancels. */
export function pickGeoJsonFile(): Promise<PickedFile | null> {
  return pickOneFile(GEOJSON_TYPES, 'application/geo+json');
}

async function pickOneFile(types: string[], fallbackType: string): Promise<PickedFile | null> {
  const result = await DocumentPicker.getDocumentAsync({
    type: types,
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
      form.append(field, { uri: asset.uri, name: asset.name, type: asset.mimeType ?? fallbackType } as unknown as Blob);
    },
  };
}
