/** The current text of the input, textarea or select an event came from (template helper). */
export function inputValue(e: Event): string {
  return (e.target as HTMLInputElement | HTMLTextAreaElement | HTMLSelectElement).value;
}
