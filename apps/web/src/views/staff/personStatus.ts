import { CheckCircleOutlined, MailOutlined, StopOutlined } from '@ant-design/icons-vue';
import type { PersonStatus } from '@busbar/shared';
import type { Component } from 'vue';
import type { Tone } from '../../theme.ts';

/** How a person's status reads on screen: a word, an icon and a tone, never colour alone. */
export const PERSON_STATUS: Record<PersonStatus, { label: string; tone: Tone; icon: Component }> = {
  active: { label: 'Active', tone: 'success', icon: CheckCircleOutlined },
  invited: { label: 'Invited', tone: 'info', icon: MailOutlined },
  inactive: { label: 'Deactivated', tone: 'neutral', icon: StopOutlined },
};
