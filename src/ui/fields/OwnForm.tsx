import { createContext, type ReactElement, type ReactNode, useContext, useId } from 'react';

/*
 * A form of its own for one text box (or one box and its unit menu), which the box belongs to
 * through its `form` attribute:
 *
 *   const form = useOwnForm();
 *   <input form={form.id} …/>{form.element}
 *
 * A browser that offers to fill in forms looks over the form of a control on every change typed
 * into it. Controls in no form count, for that look, as one form of every such control on the
 * page: hundreds in a large plan, tens of milliseconds after each keystroke (measured in Chromium:
 * 44–51 ms after every keystroke of the largest plan, 1 ms with a form each). In a form of its own
 * only the one box is looked at. The form is empty and hidden, and Enter in the box submits nothing.
 *
 * Boxes inside a small form of the page's own (a card whose button or Enter applies its fields)
 * stay in that form: wrap its fields in <InPageForm>.
 */

const PageForm = createContext(false);

/** Fields within stay in the page's form around them (it is small) instead of taking forms of their own. */
export function InPageForm({ children }: { children: ReactNode }) {
  return <PageForm.Provider value={true}>{children}</PageForm.Provider>;
}

/** Whether the caller is inside a form of the page's own ({@link InPageForm}). */
export function useInPageForm(): boolean {
  return useContext(PageForm);
}

/** The empty, hidden form a box names in its `form` attribute. */
export function OwnForm({ id }: { id: string }) {
  return <form id={id} hidden onSubmit={(event) => event.preventDefault()} />;
}

/** An id for a box's own form, and the form to render anywhere near the box. */
export function useOwnForm(): { id: string; element: ReactElement } {
  const id = `${useId()}-form`;
  return { id, element: <OwnForm id={id} /> };
}
