package steelyard.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import steelyard.rescore.WeightsFile;
import steelyard.rescore.WeightsSpec;

/** {@code --vote-confidence}: confidence columns weigh each system's vote in the confusion network. */
class VoteConfidenceTest {
  @TempDir Path dir;
  private Path hyps;

  /**
   * Three systems, one line each (the OCR layout), differing only in the third word: pears / pearls / bears.
   * With equal system weights every line's mass is 1/3, so the third slot ties 1-1-1.
   */
  @BeforeEach
  void files() throws IOException {
    hyps = dir.resolve("hyps.csv");
    Files.writeString(hyps, String.join("\n",
        "utt_id,system,rank,text,conf",
        "u1,a,1,ten crates pears,0.2",
        "u1,b,1,ten crates pearls,0.5",
        "u1,c,1,ten crates bears,0.3",
        ""), StandardCharsets.UTF_8);
  }

  private String chosenText(String... extra) throws IOException {
    Path out = dir.resolve("picks.csv");
    String[] base = {"rescore", "--hyps", hyps.toString(), "--features", "conf:linear", "--method", "consensus",
        "--out", out.toString(), "--json", dir.resolve("s.json").toString()};
    String[] args = new String[base.length + extra.length];
    System.arraycopy(base, 0, args, 0, base.length);
    System.arraycopy(extra, 0, args, base.length, extra.length);
    RescoreCommandTest.Result r = RescoreFixtures.run(args);
    assertThat(r.code()).as(r.err()).isZero();
    List<String[]> rows = RescoreFixtures.readCsv(out);
    int col = List.of(rows.get(0)).indexOf("text");
    return rows.get(1)[col];
  }

  @Test
  void confidencesDecideASlotThatEqualSystemWeightsTie() throws IOException {
    // Hand-worked (mass = system weight × within-system posterior × exp(ln conf), renormalised):
    //   a: 1/3 · 1 · 0.2 = 0.0667,  b: 1/3 · 1 · 0.5 = 0.1667,  c: 1/3 · 1 · 0.3 = 0.1000;  sum 1/3
    //   renormalised: a 0.2, b 0.5, c 0.3, so the third slot's highest-posterior arc is "pearls"
    //   (consensus decoding picks the highest-posterior arc per slot: Mangu, Brill & Stolcke 2000).
    assertThat(chosenText("--vote-confidence", "conf")).isEqualTo("ten crates pearls");
    // Without confidences the 1/3-1/3-1/3 tie goes to the first-entered hypothesis (input order), system a;
    // so the confidences, not the tie break, made the difference above.
    assertThat(chosenText()).isEqualTo("ten crates pears");
  }

  @Test
  void systemWeightsStillMultiplyTheConfidences() throws IOException {
    // a weighs 3: a 3·0.2 = 0.6, b 1·0.5 = 0.5, c 1·0.3 = 0.3 → a wins (0.6/1.4 = 0.43 of the mass).
    assertThat(chosenText("--vote-confidence", "conf", "--system-weight", "a=3")).isEqualTo("ten crates pears");
  }

  @Test
  void savedWeightsFileRoundTripsTheVoteConfidenceAndTheFileSuppliesIt() throws IOException {
    Path saved = dir.resolve("w.json");
    chosenText("--vote-confidence", "conf", "--save-weights", saved.toString());
    assertThat(Files.readString(saved)).contains("\"vote_confidence\" : \"conf\"");
    WeightsSpec back = WeightsFile.read(saved, List.of("conf"));
    assertThat(back.voteConfidence).isEqualTo("conf");
    assertThat(chosenText("--weights", saved.toString())).isEqualTo("ten crates pearls");

    Path plain = dir.resolve("plain.json");
    chosenText("--save-weights", plain.toString());
    assertThat(Files.readString(plain)).contains("\"vote_confidence\" : null");
    assertThat(WeightsFile.read(plain, List.of("conf")).voteConfidence).isNull();
    // The option overrides the file.
    assertThat(chosenText("--weights", plain.toString(), "--vote-confidence", "conf")).isEqualTo("ten crates pearls");
  }

  @Test
  void unknownVoteConfidenceNameIsAnInputError() throws IOException {
    RescoreCommandTest.Result r = RescoreFixtures.run("rescore", "--hyps", hyps.toString(), "--features", "conf:linear",
        "--method", "consensus", "--vote-confidence", "certainty", "--out", dir.resolve("p.csv").toString());
    assertThat(r.code()).isEqualTo(2);
    assertThat(r.err()).contains("--vote-confidence").contains("certainty").doesNotContain("Exception");

    Path bad = dir.resolve("bad.json");
    Files.writeString(bad, "{\"format\": \"steelyard-weights\", \"version\": 1, \"methods\": {\"lattice\": {\"vote_confidence\": \"certainty\"}}}\n");
    RescoreCommandTest.Result f = RescoreFixtures.run("rescore", "--hyps", hyps.toString(), "--features", "conf:linear",
        "--method", "consensus", "--weights", bad.toString(), "--out", dir.resolve("p.csv").toString());
    assertThat(f.code()).isEqualTo(2);
    assertThat(f.err()).contains("bad.json").contains("certainty");
  }
}
