import type { ChangePasswordRequest } from '@stormhour/shared';
import { useMutation } from '@tanstack/react-query';
import { api } from '../../config/paths';
import { request } from '../../lib/api';

export function changePassword(body: ChangePasswordRequest): Promise<void> {
  return request<void>(api.password, { method: 'POST', body });
}

export function useChangePassword() {
  return useMutation({ mutationFn: changePassword });
}
