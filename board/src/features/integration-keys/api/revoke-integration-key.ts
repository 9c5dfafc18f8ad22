import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { IntegrationKeyDto } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';
import { integrationKeysQueryOptions } from './get-integration-keys';

export function revokeIntegrationKey(id: number): Promise<IntegrationKeyDto> {
  return officeApi.delete<IntegrationKeyDto>(`/integration-keys/${id}`);
}

export function useRevokeIntegrationKey() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: revokeIntegrationKey,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: integrationKeysQueryOptions().queryKey }),
  });
}
