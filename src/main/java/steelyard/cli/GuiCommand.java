package steelyard.cli;

import java.awt.GraphicsEnvironment;
import java.awt.event.WindowAdapter;
import java.awt.event.WindowEvent;
import java.nio.file.Path;
import java.util.concurrent.Callable;
import java.util.concurrent.CountDownLatch;
import javax.swing.SwingUtilities;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;
import steelyard.demo.DemoFiles;
import steelyard.gui.SteelyardWindow;
import steelyard.gui.WindowPrefs;
import steelyard.gui.model.OpenRequest;
import steelyard.io.InputException;
import steelyard.rescore.RescoreMethod;

/**
 * {@code steelyard gui}: the desktop window. Without files it opens the bundled demo (the voice-log dev set,
 * its model and weights); with {@code --hyps} it opens the given files. Returns when the window is closed.
 */
@Command(name = "gui", mixinStandardHelpOptions = true, sortOptions = false,
    description = "Open the desktop window: see every choice, move the weights live, chart the error. "
        + "Without --hyps it opens the bundled demo.")
public final class GuiCommand implements Callable<Integer> {
  @Spec CommandSpec spec;

  @Option(names = "--hyps", paramLabel = "FILE", description = "Hypotheses CSV (.gz accepted); without it the demo opens.")
  Path hyps;

  @Mixin ImportInput imports;
  @Mixin ReferencesInput references;
  @Mixin LmModelInput model;
  @Mixin RescoreWeightOptions weights;
  @Mixin NormalisationInput normalisation;

  @Option(names = "--method", paramLabel = "nbest|mbr|consensus|lattice", description = "How to choose at first (default nbest).")
  RescoreMethod method;

  @Override
  public Integer call() throws Exception {
    OpenRequest request = request();
    if (GraphicsEnvironment.isHeadless()) {
      throw InputException.option("gui", "no display to open a window on (DISPLAY is not set or Java runs headless)",
          "a desktop session or an X server; the command line works without one");
    }
    CountDownLatch closed = new CountDownLatch(1);
    SwingUtilities.invokeAndWait(() -> SteelyardWindow.start(request, WindowPrefs.user()).addWindowListener(new WindowAdapter() {
      @Override public void windowClosed(WindowEvent e) {
        closed.countDown();
      }
    }));
    closed.await();
    return Main.OK;
  }

  /** The files to open: the demo without --hyps, else what the options name. */
  OpenRequest request() {
    if (hyps == null) {
      if (references.refs != null || model.lm != null || weights.weightsFile != null || imports.features != null)
        throw InputException.option("--hyps", "missing while --refs, --lm, --weights or --features is given",
            "--hyps FILE, or no file options at all for the demo");
      return OpenRequest.demo(DemoFiles.root()).with(weights.spec(), method);
    }
    boolean unitGiven = spec.commandLine().getParseResult().hasMatchedOption("--unit");
    return new OpenRequest(hyps, references.refs, model.lm, null, 3, weights.weightsFile, weights.spec(), imports.featureSpecs(),
        imports.primarySystem, unitGiven ? normalisation.unit : null, normalisation.options(), method, imports.maxBadRows,
        model.unknownLog10);
  }
}
