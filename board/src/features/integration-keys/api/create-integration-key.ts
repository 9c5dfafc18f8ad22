import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreatedIntegrationKey, CreateIntegrationKeyBody } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';
import { integrationKeysQueryOptions } from './get-integration-keys';

export function createIntegrationKey(body: CreateIntegrationKeyBody): Promise<CreatedIntegrationKey> {
  return officeApi.post<CreatedIntegrationKey>('/integration-keys', body);
}

export function useCreateIntegrationKey() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createIntegrationKey,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: integrationKeysQueryOptions().queryKey }),
  });
}
