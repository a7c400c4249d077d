/**
 * Enter in a text field saves a form that is not a <form> of its own (one nested in a bigger
 * form); it never submits the outer form. Enter in a select or a text area keeps its usual job.
 */
export function useEnterToSave(save: () => void) {
  return (event: KeyboardEvent) => {
    const target = event.target as HTMLElement | null;
    if (!(target instanceof HTMLInputElement) || target.getAttribute('role') === 'combobox') return;
    event.preventDefault();
    save();
  };
}
