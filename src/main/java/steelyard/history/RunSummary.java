package steelyard.history;

import java.time.Instant;
import steelyard.eval.Bootstrap;
import steelyard.text.Unit;

/**
 * One line of the history's run list: what tells runs apart at a glance, without their inputs and rows.
 *
 * @param id              the run's id in its history file (1, 2, …, in recording order)
 * @param startedAt       when the run started (UTC)
 * @param command         the command's name
 * @param label           the run's name; null when none
 * @param dataSha256      SHA-256 of the references file; null when the run had none
 * @param method          how transcripts were picked
 * @param unit            token unit of the counts
 * @param utterances      included utterances
 * @param referenceTokens N over the included utterances
 * @param errors          S + D + I over the included utterances
 * @param ci95            95 % bootstrap interval of the error rate ({@link Bootstrap.Interval#UNDEFINED} when none)
 */
public record RunSummary(
    long id, Instant startedAt, String command, String label, String dataSha256, String method, Unit unit,
    long utterances, long referenceTokens, long errors, Bootstrap.Interval ci95) {

  /** (S + D + I) / N as a fraction; NaN when N = 0. */
  public double errorRate() {
    return referenceTokens == 0 ? Double.NaN : (double) errors / referenceTokens;
  }
}
