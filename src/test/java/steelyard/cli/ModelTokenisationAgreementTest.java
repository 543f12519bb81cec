package steelyard.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import picocli.CommandLine;

/**
 * The {@code lm} commands and {@code rescore} tokenise text for a model by the same rule ({@code lm.ModelText}):
 * on the same model, text and rules file, {@code rescore}'s per-hypothesis ln P equals
 * {@code lm sentence-scores}' log10 P × ln 10 (the change of base; sentence-scores prints 6 decimals). The model
 * folds case and the rules file maps a word the model has never seen onto one it knows, so a rule that ignored
 * either would score differently.
 */
class ModelTokenisationAgreementTest {
  @TempDir static Path dir;
  static Path model;
  static Path text;
  static Path rules;

  @BeforeAll
  static void trainAModelThatFoldsCase() throws Exception {
    Path corpus = Files.writeString(dir.resolve("corpus.txt"),
        "Ten Crates of Pears\nten crates of apples\nload the crates at bay four\nthe pears are in bay nine\n");
    model = dir.resolve("m.arpa");
    assertThat(run("lm", "train", "--text", corpus.toString(), "--order", "2", "--fold-case", "--out", model.toString())).isZero();
    text = Files.writeString(dir.resolve("t.txt"), "Ten boxes of Pears\nload the BOXES at bay nine\nthe pears\n");
    rules = Files.writeString(dir.resolve("r.rules"), "equate crates = boxes\n");
  }

  static int run(String... args) {
    CommandLine cl = Main.commandLine();
    StringWriter sink = new StringWriter();
    cl.setOut(new PrintWriter(sink));
    cl.setErr(new PrintWriter(sink));
    int code = cl.execute(args);
    assertThat(code).as(sink.toString()).isZero();
    return code;
  }

  /** log10 P of each line of the text by {@code lm sentence-scores}. */
  static List<Double> sentenceScores(String... extra) throws Exception {
    Path csv = Files.createTempFile(dir, "ss", ".csv");
    List<String> args = new ArrayList<>(List.of("lm", "sentence-scores", "--lm", model.toString(), "--text", text.toString(),
        "--csv", csv.toString()));
    args.addAll(List.of(extra));
    run(args.toArray(new String[0]));
    List<Double> out = new ArrayList<>();
    for (String[] row : RescoreFixtures.readCsv(csv).subList(1, 4)) out.add(Double.parseDouble(row[3]));
    return out;
  }

  /** ln P of each line as a hypothesis in {@code rescore}'s breakdown. */
  static List<Double> rescoreLnP(String... normalisation) throws Exception {
    StringBuilder h = new StringBuilder("utt_id,text,acoustic\n");
    List<String> lines = Files.readAllLines(text);
    for (int i = 0; i < lines.size(); i++) h.append("u").append(i).append(',').append(lines.get(i)).append(",0\n");
    Path hyps = Files.writeString(Files.createTempFile(dir, "h", ".csv"), h.toString());
    Path breakdown = Files.createTempFile(dir, "bd", ".csv");
    List<String> args = new ArrayList<>(List.of("rescore", "--hyps", hyps.toString(), "--features", "acoustic", "--lm", model.toString(),
        "--lm-weight", "1", "--rules", rules.toString(), "--breakdown", breakdown.toString(), "--json", dir.resolve("j.json").toString()));
    args.addAll(List.of(normalisation));
    run(args.toArray(new String[0]));
    List<String[]> rows = RescoreFixtures.readCsv(breakdown);
    int col = List.of(rows.get(0)).indexOf("lm_ln_prob");
    List<Double> out = new ArrayList<>();
    for (String[] row : rows.subList(1, rows.size())) out.add(Double.parseDouble(row[col]));
    return out;
  }

  @ParameterizedTest(name = "[{index}] rescore normalisation ''{0}''")
  @ValueSource(strings = {"", "--fold-case", "--strip-punct"})
  void rescoreAndSentenceScoresGiveTheSameLogProbability(String option) throws Exception {
    List<Double> log10 = sentenceScores("--rules", rules.toString());
    List<Double> ln = rescoreLnP(option.isEmpty() ? new String[0] : new String[] {option});
    assertThat(ln).hasSize(3);
    for (int i = 0; i < 3; i++) {
      // change of base: ln P = log10 P · ln 10; tolerance covers the 6 printed decimals of log10 P
      assertThat(ln.get(i)).as("line %d", i + 1).isCloseTo(log10.get(i) * Math.log(10), org.assertj.core.data.Offset.offset(1e-5));
    }
  }

  @Test
  void theRulesFileChangesTheModelsTokensSoTheCheckIsNotVacuous() throws Exception {
    assertThat(sentenceScores().get(0)).isNotCloseTo(sentenceScores("--rules", rules.toString()).get(0),
        org.assertj.core.data.Offset.offset(1e-3));
  }
}
