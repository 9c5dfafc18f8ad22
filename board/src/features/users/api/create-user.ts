import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateUserBody, UserDto } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';
import { usersQueryOptions } from '@/lib/api/get-users';

export function createUser(body: CreateUserBody): Promise<UserDto> {
  return officeApi.post<UserDto>('/users', body);
}

export function useCreateUser() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createUser,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: usersQueryOptions().queryKey }),
  });
}
