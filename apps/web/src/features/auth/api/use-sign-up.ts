import { useMutation, useQueryClient } from '@tanstack/react-query';
import {
  messageResponseSchema,
  sessionEnvelopeSchema,
  type SignUpConfirmInput,
  type SignUpInput,
} from '@heatfleet/domain';
import { apiClient } from '@/lib/api-client';
import { startSession } from '@/lib/auth';

/** Asks for the firm: the answer is the same for any address, and the link comes by e-mail. */
export function signUp(input: SignUpInput) {
  return apiClient.post('/api/auth/sign-up', input, messageResponseSchema);
}

export function useSignUp() {
  return useMutation({ mutationFn: signUp });
}

/** The link from the e-mail creates the account and the firm, and signs the person in. */
export function confirmSignUp(input: SignUpConfirmInput) {
  return apiClient.post('/api/auth/sign-up/confirm', input, sessionEnvelopeSchema);
}

export function useConfirmSignUp() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: confirmSignUp,
    onSuccess: (session) => startSession(queryClient, session),
  });
}
