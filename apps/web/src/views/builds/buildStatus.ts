import {
  CalendarOutlined,
  CheckCircleOutlined,
  FileTextOutlined,
  FormOutlined,
  SafetyCertificateOutlined,
  StopOutlined,
  ToolOutlined,
} from '@ant-design/icons-vue';
import { BUILD_STATUS_LABELS, type BuildStatus } from '@busbar/shared';
import type { Component } from 'vue';
import type { Tone } from '../../theme.ts';

const look: Record<BuildStatus, { tone: Tone; icon: Component }> = {
  draft: { tone: 'neutral', icon: FormOutlined },
  quoted: { tone: 'info', icon: FileTextOutlined },
  booked: { tone: 'info', icon: CalendarOutlined },
  in_bay: { tone: 'warning', icon: ToolOutlined },
  quality_check: { tone: 'warning', icon: SafetyCertificateOutlined },
  delivered: { tone: 'success', icon: CheckCircleOutlined },
  cancelled: { tone: 'neutral', icon: StopOutlined },
};

/** How a build's status reads on screen: its word, an icon and a tone, never colour alone. */
export function buildStatusTag(status: BuildStatus): { label: string; tone: Tone; icon: Component } {
  return { label: BUILD_STATUS_LABELS[status], ...look[status] };
}

/** Delivered and cancelled builds take no more components or status changes in the bay. */
export function isClosed(status: BuildStatus): boolean {
  return status === 'delivered' || status === 'cancelled';
}

/** A cancelled build was never installed, so its serial-numbered components need no serial. */
export function asksForSerials(status: BuildStatus): boolean {
  return status !== 'cancelled';
}
