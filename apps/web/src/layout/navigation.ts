import { AuditOutlined, HomeOutlined, MailOutlined, TeamOutlined } from '@ant-design/icons-vue';
import type { Component } from 'vue';

/** The main menu; each entry opens the route of the same name, whose meta says who may use it. */
export const NAVIGATION: { route: string; label: string; icon: Component }[] = [
  { route: 'overview', label: 'Overview', icon: HomeOutlined },
  { route: 'staff', label: 'Staff', icon: TeamOutlined },
  { route: 'outbox', label: 'Outbox', icon: MailOutlined },
  { route: 'audit', label: 'Audit log', icon: AuditOutlined },
];
