import {
  AppstoreOutlined,
  AuditOutlined,
  BarcodeOutlined,
  ContactsOutlined,
  HomeOutlined,
  MailOutlined,
  ShopOutlined,
  TeamOutlined,
  ThunderboltOutlined,
  ToolOutlined,
} from '@ant-design/icons-vue';
import type { Component } from 'vue';

/** The main menu; each entry opens the route of the same name, whose meta says who may use it. */
export const NAVIGATION: { route: string; label: string; icon: Component }[] = [
  { route: 'overview', label: 'Overview', icon: HomeOutlined },
  { route: 'builds', label: 'Builds', icon: ToolOutlined },
  { route: 'plans', label: 'Quick plans', icon: ThunderboltOutlined },
  { route: 'customers', label: 'Customers', icon: ContactsOutlined },
  { route: 'serials', label: 'Find a serial', icon: BarcodeOutlined },
  { route: 'catalog', label: 'Catalog', icon: AppstoreOutlined },
  { route: 'vendors', label: 'Vendors', icon: ShopOutlined },
  { route: 'staff', label: 'Staff', icon: TeamOutlined },
  { route: 'outbox', label: 'Outbox', icon: MailOutlined },
  { route: 'audit', label: 'Audit log', icon: AuditOutlined },
];
