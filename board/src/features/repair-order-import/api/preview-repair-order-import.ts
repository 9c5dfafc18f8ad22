import { useMutation } from '@tanstack/react-query';
import type { RepairOrderImportBody, RepairOrderImportResult } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';

/** What the file would write, with its errors; nothing is saved. */
export function previewRepairOrderImport(body: RepairOrderImportBody): Promise<RepairOrderImportResult> {
  return officeApi.post<RepairOrderImportResult>('/repair-order-imports/preview', body);
}

export function usePreviewRepairOrderImport() {
  return useMutation({ mutationFn: previewRepairOrderImport });
}
