import {
  CheckCircleOutlined,
  CloseCircleOutlined,
  DollarOutlined,
  FileSearchOutlined,
  FormOutlined,
  LockOutlined,
  SendOutlined,
} from '@ant-design/icons-vue';
import { CLAIM_STATUS_LABELS, type ClaimDetail, type ClaimStatus } from '@busbar/shared';
import type { Component } from 'vue';
import type { Tone } from '../../theme.ts';

const look: Record<ClaimStatus, { tone: Tone; icon: Component }> = {
  logged: { tone: 'neutral', icon: FormOutlined },
  evidence_ready: { tone: 'info', icon: FileSearchOutlined },
  sent_to_vendor: { tone: 'warning', icon: SendOutlined },
  approved: { tone: 'success', icon: CheckCircleOutlined },
  denied: { tone: 'danger', icon: CloseCircleOutlined },
  credited: { tone: 'success', icon: DollarOutlined },
  closed: { tone: 'neutral', icon: LockOutlined },
};

/** How a claim's status reads on screen: its word, an icon and a tone, never colour alone. */
export function claimStatusTag(status: ClaimStatus): { label: string; tone: Tone; icon: Component } {
  return { label: CLAIM_STATUS_LABELS[status], ...look[status] };
}

/** The stages a claim passes, in order; a denied claim skips the credit. */
export function claimStages(denied: boolean): ClaimStatus[] {
  return ['logged', 'evidence_ready', 'sent_to_vendor', ...(denied ? (['denied'] as const) : (['approved', 'credited'] as const)), 'closed'];
}

/** Whether the vendor denied the claim: it stands denied now, or was denied before it was closed. */
export const wasDenied = (claim: Pick<ClaimDetail, 'status' | 'events'>) => claim.status === 'denied' || claim.events.some((e) => e.toStatus === 'denied');

/** Claims may be edited until the vendor has answered (as the API allows). */
export const isEditable = (status: ClaimStatus) => ['logged', 'evidence_ready', 'sent_to_vendor'].includes(status);
