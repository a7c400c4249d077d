import {
  AppstoreOutlined,
  AuditOutlined,
  BarChartOutlined,
  BarcodeOutlined,
  CalculatorOutlined,
  CalendarOutlined,
  CarOutlined,
  ContactsOutlined,
  EnvironmentOutlined,
  ExportOutlined,
  FileProtectOutlined,
  HomeOutlined,
  LineChartOutlined,
  MailOutlined,
  ShopOutlined,
  TableOutlined,
  TeamOutlined,
  ThunderboltOutlined,
  ToolOutlined,
} from '@ant-design/icons-vue';
import type { Role } from '@busbar/shared';
import type { Component } from 'vue';

/** The kinds of work the menu is grouped by (DESIGN.md, "Look"); the overview stands above them. */
export type NavigationGroup = 'Shop floor' | 'Warranty' | 'Network' | 'Money';

/**
 * The main menu; each entry opens the route of the same name, whose meta says who may use it.
 * `roles` keeps a person's own work (their bay, their shop's week) to those who do it: the owner
 * may open every page but leads no bay.
 */
export const NAVIGATION: { route: string; label: string; icon: Component; group?: NavigationGroup; roles?: Role[] }[] = [
  { route: 'overview', label: 'Overview', icon: HomeOutlined },
  { route: 'shop-week', label: 'This week', icon: CalendarOutlined, group: 'Shop floor', roles: ['location_lead'] },
  { route: 'my-bay', label: 'My bay today', icon: CarOutlined, group: 'Shop floor', roles: ['location_lead', 'technician'] },
  { route: 'builds', label: 'Builds', icon: ToolOutlined, group: 'Shop floor' },
  { route: 'plans', label: 'Quick plans', icon: ThunderboltOutlined, group: 'Shop floor' },
  { route: 'customers', label: 'Customers', icon: ContactsOutlined, group: 'Shop floor' },
  { route: 'serials', label: 'Find a serial', icon: BarcodeOutlined, group: 'Shop floor' },
  { route: 'claims', label: 'Claims', icon: FileProtectOutlined, group: 'Warranty' },
  { route: 'reliability', label: 'Reliability', icon: LineChartOutlined, group: 'Warranty' },
  { route: 'compare', label: 'Locations compared', icon: BarChartOutlined, group: 'Network' },
  { route: 'catalog', label: 'Catalog', icon: AppstoreOutlined, group: 'Network' },
  { route: 'vendors', label: 'Vendors', icon: ShopOutlined, group: 'Network' },
  { route: 'locations', label: 'Locations', icon: EnvironmentOutlined, group: 'Network' },
  { route: 'staff', label: 'Staff', icon: TeamOutlined, group: 'Network' },
  { route: 'outbox', label: 'Outbox', icon: MailOutlined, group: 'Network' },
  { route: 'audit', label: 'Audit log', icon: AuditOutlined, group: 'Network' },
  { route: 'closes', label: 'Month close', icon: CalculatorOutlined, group: 'Money' },
  { route: 'close-status', label: 'Close status', icon: TableOutlined, group: 'Money' },
  { route: 'exports', label: 'Exports', icon: ExportOutlined, group: 'Money' },
];
