import type { InterventionCode } from '../../../../shared/schemas/admin';

export const KIND_WORDS = { core: 'Core programme', addon: 'Add-on' } as const;
export const CODE_STATUS_WORDS: Record<InterventionCode['status'], string> = {
  accepted: 'In use',
  proposed: 'Waiting for the steward',
  declined: 'Declined',
};
