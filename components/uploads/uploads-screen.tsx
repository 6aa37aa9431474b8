import { Section, Page } from '@/components/layout/page';
import type { QueryState } from '@/components/state/query-state';
import { TextLink } from '@/components/ui/text-link';
import type { UploadProgressView } from '@/hooks/use-uploads';
import type { PickedFile } from '@/lib/pick-file.types';
import type { RevertAnswer, UploadAnswer, UploadListResponse, UploadOptions } from '@/contracts/uploads';

import { UploadHistory } from './upload-history';
import { UploadPanel } from './upload-panel';

export type UploadsScreenProps = {
  uploads: QueryState<UploadListResponse>;
  changeFactor: number | null;
  pickFile: () => Promise<PickedFile | null>;
  onPreview: (file: PickedFile, options: UploadOptions) => Promise<UploadAnswer>;
  onCommit: (uploadId: number) => Promise<UploadAnswer>;
  onRevert: (uploadId: number) => Promise<RevertAnswer>;
  /** The running check or load (hooks/use-uploads.ts `useUploadProgress`). */
  progress?: UploadProgressView | null;
};

/** Load series from a CSV (check, then load) and the history of every upload with Revert. */
export function UploadsScreen({
  uploads,
  changeFactor,
  pickFile,
  onPreview,
  onCommit,
  onRevert,
  progress = null,
}: UploadsScreenProps) {
  return (
    <Page
      title="Uploads"
      intro="Load yearly series from the statistics offices and emission inventories. Every row is checked before anything is written, and any upload can be reverted."
      testID="uploads-screen"
    >
      <Section title="Load a file">
        <UploadPanel
          changeFactor={changeFactor}
          pickFile={pickFile}
          onPreview={onPreview}
          onCommit={onCommit}
          progress={progress}
        />
      </Section>
      <Section title="District boundaries">
        <TextLink href="/uploads/boundaries" label="Load district boundaries (GeoJSON) and see their versions" />
      </Section>
      <Section title="Upload history">
        <UploadHistory uploads={uploads} onRevert={onRevert} />
      </Section>
    </Page>
  );
}
