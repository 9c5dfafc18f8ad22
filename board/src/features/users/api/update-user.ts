import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { UpdateUserBody, UserDto } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';
import { usersQueryOptions } from '@/lib/api/get-users';

export function updateUser({ id, ...body }: UpdateUserBody & { id: number }): Promise<UserDto> {
  return officeApi.patch<UserDto>(`/users/${id}`, body);
}

export function useUpdateUser() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateUser,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: usersQueryOptions().queryKey }),
  });
}
