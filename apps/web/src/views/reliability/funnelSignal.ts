import { ArrowDownOutlined, ArrowUpOutlined, CheckOutlined, RiseOutlined, FallOutlined } from '@ant-design/icons-vue';
import { FUNNEL_SIGNAL_LABELS, type FunnelSignal } from '@busbar/shared';
import type { Component } from 'vue';
import type { Tone } from '../../theme.ts';

const LOOKS: Record<FunnelSignal, { tone: Tone; icon: Component }> = {
  above_998: { tone: 'danger', icon: ArrowUpOutlined },
  above_95: { tone: 'warning', icon: RiseOutlined },
  within: { tone: 'neutral', icon: CheckOutlined },
  below_95: { tone: 'info', icon: FallOutlined },
  below_998: { tone: 'success', icon: ArrowDownOutlined },
};

/** A shop's place against the funnel as a status tag: a word and an icon, the colour only beside them. */
export const funnelSignalTag = (signal: FunnelSignal) => ({ ...LOOKS[signal], label: FUNNEL_SIGNAL_LABELS[signal] });
