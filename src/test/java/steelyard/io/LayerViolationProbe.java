package steelyard.io;

import steelyard.cli.Main;

/**
 * A class of the io package that uses the command line, which the package map forbids: it exists (in test
 * code only) so that the architecture test can show its layer rule catches such a dependency.
 */
public final class LayerViolationProbe {
  private LayerViolationProbe() {}

  public static int runTheCommandLine(String... args) {
    return Main.run(args);
  }
}
