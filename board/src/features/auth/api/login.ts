import { useMutation, useQueryClient } from '@tanstack/react-query';
import { OFFICE_ROLES, type LoginBody, type Role, type SignInAnswer } from '@baytime/shared';
import { publicApi } from '@/lib/api-client';
import { officeToken } from '@/lib/token-store';
import { meQueryOptions } from './get-me';

export function login(body: LoginBody): Promise<SignInAnswer> {
  return publicApi.post<SignInAnswer>('/auth/login', body);
}

export function isOfficeRole(role: Role): role is (typeof OFFICE_ROLES)[number] {
  return (OFFICE_ROLES as readonly Role[]).includes(role);
}

/** Signs in; only office roles keep their token here (technicians use the kiosk, screens the wall). */
export function useLogin() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: login,
    onSuccess: ({ accessToken, user }) => {
      if (!isOfficeRole(user.role)) return;
      queryClient.setQueryData(meQueryOptions().queryKey, user);
      officeToken.set(accessToken);
    },
  });
}
