import { FAILURE_MODE_LABELS, type ClaimView } from '@busbar/shared';

/** The return request Busbar sends a vendor: our own wording, every fact the vendor asks for, the evidence attached. */
export function vendorRequest(claim: Omit<ClaimView, 'overdue'>, shop: { name: string }, sender: { name: string; email: string }, files: number) {
  const lines = [
    `Hello ${claim.vendorName} warranty team,`,
    '',
    `${shop.name} asks for a return authorization for a unit that failed in service.`,
    '',
    `Our claim: ${claim.number}`,
    `Component: ${claim.itemName} (SKU ${claim.sku})`,
    `Serial number: ${claim.serialNumber ?? 'not recorded'}`,
    `Installed: ${claim.installedOn ?? 'unknown'}`,
    `Failed: ${claim.failedOn}`,
    `Failure: ${FAILURE_MODE_LABELS[claim.failureMode]}`,
    `What was seen: ${claim.symptoms}`,
    ...(claim.foundHow ? [`How it was found: ${claim.foundHow}`] : []),
    '',
    files > 0 ? `${files} photo${files === 1 ? '' : 's'} or document${files === 1 ? '' : 's'} of the failure are attached.` : 'No files are attached.',
    'Please answer with your authorization number and your decision.',
    '',
    `${sender.name}, ${shop.name}`,
    sender.email,
  ];
  return { subject: `Return request ${claim.number}: ${claim.itemName}, serial ${claim.serialNumber ?? 'not recorded'}`, text: lines.join('\n') };
}
