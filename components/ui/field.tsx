import type { ReactNode } from 'react';
import { cn } from './cn';

/** What a field hands its control so the label, the note and the message belong to it. */
export interface ControlProps {
  id: string;
  'aria-invalid': boolean;
  'aria-describedby'?: string;
}

interface FieldProps {
  /** The control's id: the label points at it, and the note and message ids derive from it. */
  id: string;
  label: ReactNode;
  /** A short help line under the control; a message takes its place while there is one. */
  hint?: ReactNode;
  /** What is wrong with the value, in plain words, shown under the control. */
  message?: ReactNode;
  /** More under the note: the record check's message and "is this right?" question (`FieldIssue`). */
  issue?: ReactNode;
  /** Marks the control invalid; by default, whether there is a message. */
  invalid?: boolean;
  className?: string;
  labelClassName?: string;
  /** Draws the control with the props it is given (id, aria-invalid, aria-describedby). */
  children: (control: ControlProps) => ReactNode;
}

/**
 * A label, its control, a note under it (the message, else the hint) and the issue slot. The control
 * is described by the note and the issue, so a screen reader reads the message with the field.
 */
export function Field({ id, label, hint, message, issue, invalid, className, labelClassName, children }: FieldProps) {
  const hasNote = hint !== undefined || !!message;
  const noteId = `${id}-note`;
  const issueId = `${id}-issue`;
  const describedBy = [hasNote && noteId, issue !== undefined && issueId].filter(Boolean).join(' ');
  return (
    <div className={className}>
      <label htmlFor={id} className={cn('block font-bold', labelClassName)}>
        {label}
      </label>
      {children({ id, 'aria-invalid': invalid ?? !!message, 'aria-describedby': describedBy || undefined })}
      {hasNote && (
        <p id={noteId} className={message ? 'mt-1 font-bold text-clay' : 'mt-1 text-stone'}>
          {message || hint}
        </p>
      )}
      {issue !== undefined && <div id={issueId}>{issue}</div>}
    </div>
  );
}
