import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { SignUpInput } from '@heatfleet/domain';
import { apiClient } from '@/lib/api-client';
import { sessionEnvelopeSchema, startSession } from '@/lib/auth';

export function signUp(input: SignUpInput) {
  return apiClient.post('/api/auth/sign-up', input, sessionEnvelopeSchema);
}

export function useSignUp() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signUp,
    onSuccess: (session) => startSession(queryClient, session),
  });
}
