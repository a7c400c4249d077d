import type { StaffPerson } from '@busbar/shared';
import type { TableColumnsType } from 'ant-design-vue';

export const staffColumns: TableColumnsType<StaffPerson> = [
  { key: 'name', title: 'Name', dataIndex: 'name', ellipsis: true },
  { key: 'email', title: 'E-mail', dataIndex: 'email', ellipsis: true },
  { key: 'roles', title: 'Roles' },
  { key: 'status', title: 'Status', dataIndex: 'status', width: 130 },
  { key: 'lastSignInAt', title: 'Last signed in', dataIndex: 'lastSignInAt', width: 190 },
];
