// The platform's own date and time pickers beside a typed "YYYY-MM-DD HH:MM" field. On native
// targets there is none here (the typed field stays the way in); the web target renders the
// browser's date and time inputs (platform-date-time.web.tsx), which phones show as their wheels.

export interface PlatformDateTimeProps {
  /** The wall time as the field holds it, "YYYY-MM-DD HH:MM", or '' / partial text. */
  text: string;
  onText: (text: string) => void;
  /** The field's label: the pickers are named after it ("Starts: date"). */
  label: string;
  testID: string;
}

export function PlatformDateTime(_props: PlatformDateTimeProps) {
  return null;
}
