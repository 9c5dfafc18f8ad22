import { useMutation, useQueryClient } from '@tanstack/react-query';
import { OFFICE_ROLES, type LoginBody, type OfficeSignInAnswer, type Role } from '@baytime/shared';
import { publicApi } from '@/lib/api-client';
import { officeToken } from '@/lib/token-store';
import { officeSignIn } from '../office-sign-in';
import { meQueryOptions } from './get-me';

export function login(body: LoginBody): Promise<OfficeSignInAnswer> {
  return publicApi.post<OfficeSignInAnswer>('/auth/login', body);
}

export function isOfficeRole(role: Role): role is (typeof OFFICE_ROLES)[number] {
  return (OFFICE_ROLES as readonly Role[]).includes(role);
}

function useKeepSignIn() {
  const queryClient = useQueryClient();
  return (answer: OfficeSignInAnswer, email: string) => {
    queryClient.setQueryData(meQueryOptions().queryKey, answer.user);
    officeSignIn.answered(answer.accessToken, answer, email);
    officeToken.set(answer.accessToken);
  };
}

/** Signs in; only office roles keep their token here (technicians use the kiosk, screens the wall). */
export function useLogin() {
  const keep = useKeepSignIn();
  return useMutation({
    mutationFn: login,
    onSuccess: (answer, { email }) => {
      if (isOfficeRole(answer.user.role)) keep(answer, email);
    },
  });
}

/** Someone else's password given where the signed-in person was asked for theirs. */
export class OtherPersonError extends Error {
  constructor(readonly person: string) {
    super(`That is ${person}'s sign-in`);
  }
}

/**
 * Signs the same person in again on the page they are on, for a fresh sign-in in place of one that is
 * about to end. Another person's password leaves the sign-in as it was (`OtherPersonError`).
 */
export function useSignInAgain(userId: number) {
  const keep = useKeepSignIn();
  return useMutation({
    mutationFn: async (body: LoginBody) => {
      const answer = await login(body);
      if (answer.user.id !== userId) throw new OtherPersonError(answer.user.name);
      return answer;
    },
    onSuccess: (answer, { email }) => keep(answer, email),
  });
}
