package steelyard.cli;

import picocli.CommandLine;

/** Reads the version from the jar manifest ({@code Implementation-Version}). */
final class VersionProvider implements CommandLine.IVersionProvider {
  @Override
  public String[] getVersion() {
    String v = Main.class.getPackage().getImplementationVersion();
    return new String[] {"steelyard " + (v == null ? "development build" : v)};
  }
}
