package steelyard.cli;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Nested;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import picocli.CommandLine;
import steelyard.lm.BackoffModel;
import steelyard.lm.ModelFiles;

class LmTrainCommandTest {
  @TempDir Path dir;

  record Run(int exit, String out, String err) {}

  Run run(String... args) {
    ScoreCommandTest.Result r = ScoreCommandTest.run(args);
    return new Run(r.code(), r.out(), r.err());
  }

  Path corpus() throws Exception {
    Path f = dir.resolve("corpus.txt");
    Files.writeString(f, "the crate of pears\nthe crate of apples\n\nTwo crates of pears\n", StandardCharsets.UTF_8);
    return f;
  }

  @Nested
  class Refusals {
    @Test
    void addKCannotBeSavedAsAModelFile() throws Exception {
      Run r = run("lm", "train", "--corpus", corpus().toString(), "--order", "2", "--smoothing", "addk",
          "--out", dir.resolve("m.arpa").toString());
      assertThat(r.exit()).isEqualTo(Main.BAD_INPUT);
      assertThat(r.err()).contains("--smoothing: add-k smoothing has no exact back-off form").doesNotContain("Exception");
      assertThat(dir.resolve("m.arpa")).doesNotExist();
    }

    @Test
    void theOutputMayNotOverwriteTheCorpus() throws Exception {
      Path c = dir.resolve("same.arpa");
      Files.writeString(c, "a b\n");
      Run r = run("lm", "train", "--corpus", c.toString(), "--order", "2", "--out", c.toString());
      assertThat(r.exit()).isEqualTo(Main.BAD_INPUT);
      assertThat(r.err()).contains("is the training corpus");
      assertThat(Files.readString(c)).isEqualTo("a b\n");
    }

    @Test
    void anUnknownModelFileTypeIsRefusedBeforeTraining() throws Exception {
      Run r = run("lm", "train", "--corpus", corpus().toString(), "--order", "2", "--out", dir.resolve("m.txt").toString());
      assertThat(r.exit()).isEqualTo(Main.BAD_INPUT);
      assertThat(r.err()).contains("expected a name ending in .arpa, .arpa.gz or .bin");
    }

    @Test
    void orderOutOfRangeIsRefused() throws Exception {
      String c = corpus().toString(), o = dir.resolve("m.arpa").toString();
      assertThat(run("lm", "train", "--corpus", c, "--order", "7", "--out", o).err()).contains("--order: order 7 is out of range");
    }

    @ParameterizedTest(name = "[{index}] --min-count {0}")
    @CsvSource(delimiter = '|', value = {
        "1=2       | '1=2' names order 1; expected orders 2 and up (use --vocab-min-count",
        "4=2       | '4=2' names order 4, which a 3-gram model does not have; expected an order from 2 to 3",
        "2=0       | '2=0' asks for a minimum count of 0; expected a count of 1 or more",
        "2=2,2=3   | order 2 is named twice",
        "2         | '2' is not ORDER=C",
        "2=-1      | '2=-1' is not ORDER=C",
        "x=2       | 'x=2' is not ORDER=C"})
    void malformedMinimumCountsAreRefusedWithTheRule(String value, String message) throws Exception {
      Path o = dir.resolve("m.arpa");
      Run r = run("lm", "train", "--corpus", corpus().toString(), "--order", "3", "--min-count", value, "--out", o.toString());
      assertThat(r.exit()).isEqualTo(Main.BAD_INPUT);
      assertThat(r.err()).contains("--min-count: " + message).doesNotContain("Exception");
      assertThat(o).doesNotExist();
    }

    @Test
    void aMissingCorpusIsAnInputError() {
      Run r = run("lm", "train", "--corpus", dir.resolve("none.txt").toString(), "--order", "2",
          "--out", dir.resolve("m.arpa").toString());
      assertThat(r.exit()).isEqualTo(Main.BAD_INPUT);
      assertThat(r.err()).contains("none.txt: no such file");
    }
  }

  @Nested
  class Training {
    @Test
    void writesAModelThatScoresLikeTheTrainerAndReportsInJson() throws Exception {
      Path model = dir.resolve("m.arpa");
      Run r = run("lm", "train", "--corpus", corpus().toString(), "--order", "3", "--fold-case", "--out", model.toString(),
          "--json", "-");
      assertThat(r.exit()).as(r.err()).isEqualTo(Main.OK);
      assertThat(r.err()).contains("trained a word 3-gram model (mkn)").contains("1 empty lines skipped");
      JsonNode j = new ObjectMapper().readTree(r.out());
      assertThat(j.get("sentences").asLong()).isEqualTo(3);
      assertThat(j.get("tokens").asLong()).isEqualTo(12);
      assertThat(j.get("ngrams").get(0).get("listed").asLong()).as("every token id is a listed unigram").isEqualTo(j.get("vocabulary").asLong());
      assertThat(j.get("warnings").isArray()).isTrue();

      BackoffModel lm = ModelFiles.loadExact(model);
      assertThat(lm.order()).isEqualTo(3);
      assertThat(lm.wordId("two")).as("folded at training time").isNotEqualTo(lm.unknownId());
      double p = Math.exp(lm.sentenceLogProb(List.of("the", "crate", "of", "pears")));
      assertThat(p).isGreaterThan(Math.exp(lm.sentenceLogProb(List.of("pears", "of", "crate", "the"))));
      assertThat(lm.metadata()).contains("steelyard.normalisation.fold_case=true", "steelyard.smoothing=mkn");
      double sum = 0;
      for (int id = 0; id < lm.vocabularySize(); id++) {
        if (id != lm.sentenceStartId()) sum += Math.pow(10, lm.log10Prob(new int[] {lm.wordId("crate")}, id));
      }
      assertThat(sum).as("read back from ARPA, seven digits on disk").isCloseTo(1, within(1e-5));
    }

    @Test
    void theSameCorpusGivesByteIdenticalModelFiles() throws Exception {
      Path a = dir.resolve("a.arpa"), b = dir.resolve("b.arpa");
      String c = corpus().toString();
      assertThat(run("lm", "train", "--corpus", c, "--order", "4", "--out", a.toString()).exit()).isEqualTo(Main.OK);
      assertThat(run("lm", "train", "--corpus", c, "--order", "4", "--out", b.toString()).exit()).isEqualTo(Main.OK);
      assertThat(Files.readAllBytes(a)).isEqualTo(Files.readAllBytes(b));
    }

    @Test
    void vocabularyLimitsAndMinimumCountsAreAppliedAndRecorded() throws Exception {
      Path model = dir.resolve("v.arpa");
      Run r = run("lm", "train", "--corpus", corpus().toString(), "--order", "3", "--vocab-min-count", "2",
          "--min-count", "3=2", "--smoothing", "abs", "--out", model.toString(), "--json", "-");
      assertThat(r.exit()).as(r.err()).isEqualTo(Main.OK);
      BackoffModel lm = ModelFiles.loadExact(model);
      assertThat(lm.wordId("apples")).as("seen once").isEqualTo(lm.unknownId());
      assertThat(lm.wordId("crate")).as("seen twice").isNotEqualTo(lm.unknownId());
      assertThat(lm.metadata()).contains("steelyard.vocab_min_count=2", "steelyard.smoothing=abs",
          "steelyard.min_count.1=1", "steelyard.min_count.2=1", "steelyard.min_count.3=2");
      JsonNode j = new ObjectMapper().readTree(r.out());
      assertThat(j.get("unk_tokens").asLong()).isEqualTo(3); // apples, Two, crates
      JsonNode bigrams = j.get("ngrams").get(1);
      JsonNode trigrams = j.get("ngrams").get(2);
      assertThat(bigrams.get("listed").asLong()).as("order 2 not named: all kept").isEqualTo(bigrams.get("distinct").asLong());
      assertThat(trigrams.get("listed").asLong()).isLessThan(trigrams.get("distinct").asLong());
    }

    @Test
    void characterModelsUseTheSpaceToken() throws Exception {
      Path model = dir.resolve("c.arpa.gz");
      Run r = run("lm", "train", "--corpus", corpus().toString(), "--order", "4", "--unit", "char",
          "--smoothing", "wb", "--out", model.toString());
      assertThat(r.exit()).as(r.err()).isEqualTo(Main.OK);
      BackoffModel lm = ModelFiles.loadExact(model);
      assertThat(lm.wordId("<sp>")).isNotEqualTo(lm.unknownId());
      assertThat(lm.wordId("p")).isNotEqualTo(lm.unknownId());
      assertThat(lm.metadata()).contains("steelyard.unit=char", "steelyard.smoothing=wb");
    }
  }

  @Nested
  class OldSpellingsOfRelease01 {
    @Test
    void cutoffsStillWorkAsTheMinimumCountOneHigherWithAOneLineNotice() throws Exception {
      Path old = dir.resolve("old.arpa"), current = dir.resolve("new.arpa");
      Run r = run("lm", "train", "--corpus", corpus().toString(), "--order", "3", "--cutoffs", "0,1", "--out", old.toString());
      assertThat(r.exit()).as(r.err()).isEqualTo(Main.OK);
      assertThat(r.err()).contains("steelyard: warning: --cutoffs 0,1 is an old spelling, accepted for one more release; use --min-count 2=2,3=2");
      assertThat(r.err().lines().filter(l -> l.contains("old spelling"))).hasSize(1);
      assertThat(run("lm", "train", "--corpus", corpus().toString(), "--order", "3", "--min-count", "2=2,3=2",
          "--out", current.toString()).exit()).isEqualTo(Main.OK);
      assertThat(Files.readAllBytes(old)).as("the last cut-off repeats, as it did in 0.1").isEqualTo(Files.readAllBytes(current));
    }

    @Test
    void theModelFileNeverRecordsTheOldSpelling() throws Exception {
      Path model = dir.resolve("old.arpa");
      assertThat(run("lm", "train", "--corpus", corpus().toString(), "--order", "2", "--cutoffs", "0,1", "--out", model.toString())
          .exit()).isEqualTo(Main.OK);
      assertThat(Files.readString(model)).doesNotContain("cutoff").contains("# steelyard.min_count.2=2");
    }

    @Test
    void cutoffsKeepTheirOldRules() throws Exception {
      String c = corpus().toString(), o = dir.resolve("m.arpa").toString();
      Run unigram = run("lm", "train", "--corpus", c, "--order", "3", "--cutoffs", "1,1,1", "--out", o);
      assertThat(unigram.exit()).isEqualTo(Main.BAD_INPUT);
      assertThat(unigram.err()).contains("--cutoffs: the unigram cut-off is 1");
      Run both = run("lm", "train", "--corpus", c, "--order", "3", "--cutoffs", "0,1", "--min-count", "2=2", "--out", o);
      assertThat(both.exit()).isEqualTo(Main.BAD_INPUT);
      assertThat(both.err()).contains("--cutoffs: given together with --min-count");
    }

    @Test
    void textStillNamesTheCorpusWithANotice() throws Exception {
      Path model = dir.resolve("t.arpa");
      Run r = run("lm", "train", "--text", corpus().toString(), "--order", "2", "--out", model.toString());
      assertThat(r.exit()).as(r.err()).isEqualTo(Main.OK);
      assertThat(r.err()).contains("steelyard: warning: --text is an old spelling, accepted for one more release; use --corpus");
      assertThat(model).exists();
    }

    @Test
    void theHelpShowsOnlyTheNewSpellings() {
      StringWriter help = new StringWriter();
      CommandLine cl = Main.commandLine();
      cl.setOut(new PrintWriter(help, true));
      assertThat(cl.execute("lm", "train", "--help")).isZero();
      assertThat(help.toString()).contains("--corpus", "--min-count").doesNotContain("--cutoffs").doesNotContain("--text");
    }
  }
}
