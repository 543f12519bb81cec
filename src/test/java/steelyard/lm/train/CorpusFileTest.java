package steelyard.lm.train;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.io.OutputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.zip.GZIPOutputStream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import steelyard.io.InputException;
import steelyard.lm.LanguageModel;
import steelyard.text.NormalisationOptions;
import steelyard.text.Normaliser;
import steelyard.text.Unit;

class CorpusFileTest {
  @TempDir Path dir;

  @Test
  void aGzippedCorpusTrainsTheSameModelAsItsTokens() throws Exception {
    Path gz = dir.resolve("c.txt.gz");
    try (OutputStream out = new GZIPOutputStream(Files.newOutputStream(gz))) {
      out.write("Crates of Pears\ncrates of apples\n\ntwo crates\n".getBytes(StandardCharsets.UTF_8));
    }
    NormalisationOptions folded = new NormalisationOptions(true, false, false, false, null);
    TrainingOptions options = new TrainingOptions(3, Unit.WORD, folded, Smoothing.MKN, 0, 0, new int[0], 1);
    TrainedModel fromFile = new Trainer(options).train(new CorpusFile(gz, Normaliser.create(folded), Unit.WORD));
    TrainedModel fromTokens = new Trainer(options).train(SentenceSource.of(
        TrainTestSupport.corpus("crates of pears", "crates of apples", "two crates")));
    assertThat(fromFile.report().sentences()).isEqualTo(3);
    assertThat(fromFile.report().emptyLines()).isEqualTo(1);
    for (String w : List.of("crates", "of", "pears", "two", "</s>", "<unk>")) {
      assertThat(TrainTestSupport.prob(fromFile.model(), List.of("<s>", "crates"), w))
          .isCloseTo(TrainTestSupport.prob(fromTokens.model(), List.of("<s>", "crates"), w), within(1e-15));
    }
  }

  @Test
  void characterUnitTrainsOnGraphemesWithTheSpaceToken() throws Exception {
    Path f = dir.resolve("d.txt");
    Files.writeString(f, "12 kg\npeach e\u0301\n", StandardCharsets.UTF_8);
    TrainingOptions options = new TrainingOptions(
        2, Unit.CHAR, NormalisationOptions.EXACT, Smoothing.WB, 0, 0, new int[0], 1);
    LanguageModel lm = new Trainer(options)
        .train(new CorpusFile(f, Normaliser.create(NormalisationOptions.EXACT), Unit.CHAR)).model();
    List<String> tokens = TrainTestSupport.predicted(lm);
    assertThat(tokens).contains(Normaliser.SPACE_TOKEN, "1", "k", "p").doesNotContain(" ");
    assertThat(new ArrayList<>(tokens)).contains("\u00e9");
    assertThat(TrainTestSupport.sum(lm, List.of("<s>", "1"))).isCloseTo(1, within(1e-9));
  }

  @Test
  void aReservedTokenIsReportedWithFileAndLine() throws Exception {
    Path f = dir.resolve("bad.txt");
    Files.writeString(f, "ok line\nnot <s> ok\n", StandardCharsets.UTF_8);
    assertThatThrownBy(() -> new Trainer(TrainingOptions.of(2, Smoothing.MKN))
        .train(new CorpusFile(f, Normaliser.create(NormalisationOptions.EXACT), Unit.WORD)))
        .isInstanceOf(InputException.class).hasMessageStartingWith(f + ":2: the token '<s>' is reserved");
  }
}
