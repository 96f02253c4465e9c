import { useMutation } from '@tanstack/react-query';
import { z } from 'zod';
import { ForgotInputSchema, type ForgotInput } from '../../../../shared/account';
import { apiFetch } from '../../../lib/api-client';

export const requestPasswordReset = (input: ForgotInput) =>
  apiFetch('/api/auth/forgot', z.object({ message: z.string() }), {
    method: 'POST',
    body: ForgotInputSchema.parse(input),
  });

export const useRequestPasswordReset = () =>
  useMutation({ mutationFn: requestPasswordReset, meta: { authFlow: true } });
