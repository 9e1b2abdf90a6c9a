import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { SignInInput } from '@heatfleet/domain';
import { apiClient } from '@/lib/api-client';
import { sessionEnvelopeSchema, startSession } from '@/lib/auth';

export function signIn(input: SignInInput) {
  return apiClient.post('/api/auth/sign-in', input, sessionEnvelopeSchema);
}

export function useSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signIn,
    onSuccess: (session) => startSession(queryClient, session),
  });
}
