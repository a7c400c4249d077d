import { CheckCircleOutlined, CloseCircleOutlined, ExclamationCircleOutlined, InfoCircleOutlined } from '@ant-design/icons-vue';
import type { Finding, Verdict } from '@busbar/calc';
import type { Component } from 'vue';
import type { Tone } from '../../theme.ts';

interface TagProps {
  tone: Tone;
  icon: Component;
  label: string;
}

/** A finding's severity as a word and an icon, never by colour alone. */
export function severityTag(severity: Finding['severity']): TagProps {
  return severity === 'critical'
    ? { tone: 'danger', icon: CloseCircleOutlined, label: 'Critical' }
    : { tone: 'warning', icon: ExclamationCircleOutlined, label: 'Warning' };
}

/** How the verdict reads at a glance. */
export function verdictTag(kind: Verdict['kind']): TagProps {
  switch (kind) {
    case 'no-second-battery':
      return { tone: 'success', icon: CheckCircleOutlined, label: 'Starter battery is enough' };
    case 'bank-ok':
      return { tone: 'success', icon: CheckCircleOutlined, label: 'Bank carries the trip' };
    case 'bank-needed':
      return { tone: 'info', icon: InfoCircleOutlined, label: 'House battery needed' };
    case 'bank-too-small':
      return { tone: 'danger', icon: CloseCircleOutlined, label: 'Bank too small' };
  }
}
