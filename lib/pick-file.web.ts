// Web: expo-document-picker opens a hidden <input type="file"> and hands back the File
// itself, which goes into the multipart body as it is (no base64 copy in memory).
import * as DocumentPicker from 'expo-document-picker';

import { CSV_TYPES, GEOJSON_TYPES, type PickedFile } from './pick-file.types';

export type { PickedFile } from './pick-file.types';

/** Opens the browser's file chooser for one CSV file; null when the person cancels. */
export function pickCsvFile(): Promise<PickedFile | null> {
  return pickOneFile(CSV_TYPES);
}

/** Opens the browser's file chooser for one GeoJSON file (district boundaries); null when the person cancels. */
export function pickGeoJsonFile(): Promise<PickedFile | null> {
  return pickOneFile(GEOJSON_TYPES);
}

async function pickOneFile(types: string[]): Promise<PickedFile | null> {
  const result = await DocumentPicker.getDocumentAsync({ type: types, multiple: false, base64: false });
  if (result.canceled || !result.assets?.length) return null;
  const asset = result.assets[0];
  const file = asset.file;
  if (!file) return null;
  return {
    name: file.name,
    size: file.size,
    appendTo(form, field) {
      form.append(field, file, file.name);
    },
  };
}
