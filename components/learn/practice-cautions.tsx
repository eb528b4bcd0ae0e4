// The usual cautions beside the place where practice minutes are logged (issue 6 item 5; project
// rules: defer to a qualified teacher or health professional). The advice itself is common practice
// for string players, not medical advice.
import { Alert } from "@/components/ui/alert";

export function PracticeCautions() {
  return (
    <Alert tone="warning" title="Practise safely" className="self-start">
      <ul className="ml-5 list-disc">
        <li>Warm up first: loosen your shoulders, arms and hands, and start with slow, easy bowing.</li>
        <li>Take a short break every 20–30 minutes (common practice): put the fiddle down, stretch, rest your eyes.</li>
        <li>Stop if anything hurts — pain, numbness or tingling is a sign to stop, not to play through.</li>
        <li>
          If pain comes back or lasts, see a qualified teacher about your set-up and a health professional about the
          pain.
        </li>
      </ul>
    </Alert>
  );
}
