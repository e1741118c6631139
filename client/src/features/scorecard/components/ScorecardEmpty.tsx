/** How bulletins come to be scored: said wherever there is nothing to score yet. */
export function HowToGetScores() {
  return (
    <ul className="scorecard-how">
      <li>
        Write the district’s weekly bulletin under Bulletins, have it approved and send it: only sent
        bulletins are scored.
      </li>
      <li>Each day of a bulletin’s week is scored once it has passed.</li>
      <li>
        A day needs an outcome: radar scans of that afternoon with enough coverage (uploaded under Intake), or
        an extension officer’s field report from their Inbox.
      </li>
    </ul>
  );
}
