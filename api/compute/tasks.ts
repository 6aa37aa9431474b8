/**
 * The CPU-heavy work that runs off the main event loop: a what-if curve fit, a slice of a
 * run's district fits (as records, or as the COPY text the run writes), a brief's PDF, reading and checking a boundary (GeoJSON) file. Each task takes and returns plain data (structured
 * clone), so the same function runs in a pool thread (api/compute/worker.ts) or, with a
 * pool size of 0, inline.
 *
 * An engine refusal (EstimationInputError) is returned as data, not thrown: a thread
 * boundary keeps only an error's message, and callers need its code and details.
 */
import type { DistrictBriefContent, RegionBriefContent } from '../../contracts/briefs';
import { readBoundaryFile, type BoundaryRead } from '../boundaries/read-file';
import { renderDistrictPdf } from '../briefs/pdf/district-pdf';
import { renderRegionPdf } from '../briefs/pdf/region-pdf';
import { renderSummaryPdf } from '../briefs/pdf/summary-pdf';
import type { DistrictSummaryContent } from '../briefs/summary-content';
import {
  EstimationInputError,
  fitCurve,
  type CurveRow,
  type FitCurveResult,
  type FitPanelResult,
  type ModelSpecInput,
} from '../estimation';
import { fitDistrict, type RunModel } from '../runs/district-fit';
import { estimatesCopyText } from '../runs/estimate-copy';
import type { DistrictData, EstimateRecord } from '../runs/estimate-record';

export interface EngineRefusal {
  code: string;
  message: string;
  details: Record<string, unknown>;
}

export type Task =
  | { kind: 'fit-curve'; rows: CurveRow[]; model: ModelSpecInput }
  | {
      kind: 'district-fits';
      model: RunModel;
      districts: { districtId: number; data: DistrictData }[];
      pooled: FitPanelResult | null;
    }
  | {
      kind: 'district-fits-copy';
      runId: number;
      model: RunModel;
      districts: { districtId: number; data: DistrictData }[];
      pooled: FitPanelResult | null;
    }
  | { kind: 'district-pdf'; content: DistrictBriefContent }
  | { kind: 'region-pdf'; content: RegionBriefContent }
  | { kind: 'summary-pdf'; content: DistrictSummaryContent }
  | { kind: 'boundary-read'; path: string; codeProperty: string; maxVertices: number };

export interface TaskResults {
  'fit-curve': { ok: true; result: FitCurveResult } | { ok: false; error: EngineRefusal };
  'district-fits': { districtId: number; record: EstimateRecord }[];
  /** the fitted records as COPY text (api/runs/estimate-copy.ts), one line per district and variant */
  'district-fits-copy': string;
  'district-pdf': Uint8Array;
  'region-pdf': Uint8Array;
  'summary-pdf': Uint8Array;
  'boundary-read': BoundaryRead;
}

export async function runTask(task: Task): Promise<TaskResults[Task['kind']]> {
  switch (task.kind) {
    case 'fit-curve':
      try {
        return { ok: true, result: fitCurve(task.rows, task.model) };
      } catch (err) {
        if (err instanceof EstimationInputError)
          return { ok: false, error: { code: err.code, message: err.message, details: err.details } };
        throw err;
      }
    case 'district-fits':
      return task.districts.flatMap((d) =>
        fitDistrict(task.model, d.data, task.pooled).map((record) => ({ districtId: d.districtId, record })),
      );
    case 'district-fits-copy':
      return estimatesCopyText(
        task.runId,
        task.districts.flatMap((d) =>
          fitDistrict(task.model, d.data, task.pooled).map((record) => ({ districtId: d.districtId, record })),
        ),
      );
    case 'district-pdf':
      return renderDistrictPdf(task.content);
    case 'region-pdf':
      return renderRegionPdf(task.content);
    case 'summary-pdf':
      return renderSummaryPdf(task.content);
    case 'boundary-read':
      return readBoundaryFile(task.path, task.codeProperty, task.maxVertices);
  }
}
