import { ClockCircleOutlined, FlagOutlined, LockOutlined, MinusOutlined } from '@ant-design/icons-vue';
import type { CloseCellStatus } from '@busbar/shared';
import type { Component } from 'vue';
import type { Tone } from '../../theme.ts';

/** How a month's close status reads: a word, an icon and a tone, never colour alone. */
export const CLOSE_CELL_LOOK: Record<CloseCellStatus, { label: string; tone: Tone; icon: Component }> = {
  final: { label: 'Final', tone: 'success', icon: LockOutlined },
  next: { label: 'Next to close', tone: 'warning', icon: FlagOutlined },
  open: { label: 'Open', tone: 'neutral', icon: MinusOutlined },
  running: { label: 'Running', tone: 'info', icon: ClockCircleOutlined },
};
