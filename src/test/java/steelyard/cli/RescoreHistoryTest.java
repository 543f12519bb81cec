package steelyard.cli;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** {@code --history} on rescore (with references) and audit: what is recorded, in which order, and that it reproduces the run. */
class RescoreHistoryTest {
  static {
    steelyard.report.HeadlessAwt.whenNoDisplay();
  }

  @TempDir Path dir;

  private static ScoreCommandTest.Result ok(String... args) {
    ScoreCommandTest.Result r = ScoreCommandTest.run(args);
    assertThat(r.code()).as(String.join(" ", args) + "\n" + r.err()).isZero();
    return r;
  }

  @Test
  void aRecordedRescoreIsListedAndItsWeightsReproduceThePicksByteForByte() throws IOException {
    Path db = dir.resolve("runs.db");
    Path picks = dir.resolve("picks.csv");
    ok("rescore", "--hyps", RescoreFixtures.VOICE_DEV, "--refs", "sample-hypotheses/voice-dev.refs.csv", "--rules",
        RescoreFixtures.VOICE_RULES, "--lm", RescoreFixtures.VOICE_LM, "--features", "acoustic,lm", "--lm-weight", "16",
        "--length-weight", "8", "--out", picks.toString(), "--history", db.toString());
    assertThat(ok("runs", "list", "--history", db.toString()).out()).contains("rescore").contains("nbest");
    Path back = dir.resolve("back.json");
    ok("runs", "weights", "1", "--history", db.toString(), "--out", back.toString());
    RescoreFixtures.assertVoiceDevWeightsReproduce(dir, back, picks);
  }

  /**
   * References listed in another order than the hypotheses: rows are stored in reference-file order (then the
   * utterances without a reference), and audit and rescore on the same inputs store the same rows and totals.
   */
  @Test
  void rowsFollowTheReferenceFileAndAuditStoresWhatRescoreStores() throws IOException {
    Path hyps = dir.resolve("hyps.csv");
    Path refs = dir.resolve("refs.csv");
    RescoreFixtures.writeRandomSet(hyps, refs, 7L, 60);
    List<String> lines = new ArrayList<>(Files.readAllLines(refs));
    List<String> body = new ArrayList<>(lines.subList(1, lines.size()));
    Collections.shuffle(body, new java.util.Random(new SplittableRandom(11).nextLong()));
    Path shuffled = dir.resolve("refs-shuffled.csv");
    Files.write(shuffled, concat(lines.get(0), body));
    String db = dir.resolve("runs.db").toString();
    String[] weights = {"--features", "acoustic,conf:linear", "--weight", "conf=20"};
    ok(concat(List.of("rescore", "--hyps", hyps.toString(), "--refs", shuffled.toString(), "--out", dir.resolve("p.csv").toString(),
        "--history", db), weights));
    ok(concat(List.of("audit", "--hyps", hyps.toString(), "--refs", shuffled.toString(), "--out", dir.resolve("a.json").toString(),
        "--history", db), weights));
    Path export = dir.resolve("runs.json");
    ok("runs", "export", "--history", db, "--json", export.toString(), "--utterances");
    JsonNode runs = new ObjectMapper().readTree(export.toFile());
    assertThat(runs.size()).isEqualTo(2);
    JsonNode rescore = runs.get(0);
    JsonNode audit = runs.get(1);
    assertThat(rescore.get("command").asText()).isEqualTo("rescore");
    assertThat(audit.get("command").asText()).isEqualTo("audit");
    List<String> ids = new ArrayList<>();
    for (JsonNode row : rescore.get("utterance_rows")) ids.add(row.get("utt_id").asText());
    List<String> refOrder = new ArrayList<>();
    for (String line : body) refOrder.add(line.substring(0, line.indexOf(',')));
    assertThat(ids.subList(0, refOrder.size())).containsExactlyElementsOf(refOrder);
    assertThat(ids).hasSize(60 + 1).contains("dock-lost");
    assertThat(audit.get("utterance_rows")).isEqualTo(rescore.get("utterance_rows"));
    for (String key : List.of("errors", "reference_tokens", "error_rate", "ci95_low", "ci95_high", "data_sha256", "method"))
      assertThat(audit.get(key)).as(key).isEqualTo(rescore.get(key));
  }

  @Test
  void rescoreWithoutReferencesRecordsNothingAndSaysSo() {
    Path db = dir.resolve("runs.db");
    ScoreCommandTest.Result r = ok("rescore", "--hyps", "sample-hypotheses/voice-dev.nbest.csv", "--features", "acoustic",
        "--out", dir.resolve("p.csv").toString(), "--history", db.toString());
    assertThat(r.err()).contains("run not recorded in the history");
    assertThat(db).doesNotExist();
  }

  private static String[] concat(List<String> head, String... tail) {
    List<String> all = new ArrayList<>(head);
    all.addAll(List.of(tail));
    return all.toArray(new String[0]);
  }

  private static List<String> concat(String head, List<String> tail) {
    List<String> all = new ArrayList<>();
    all.add(head);
    all.addAll(tail);
    return all;
  }
}
