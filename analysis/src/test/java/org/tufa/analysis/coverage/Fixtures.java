package org.tufa.analysis.coverage;

import java.net.URISyntaxException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Optional;

/** Test files: the committed fixtures and the shared Brick file outside the repository. */
final class Fixtures {
    private Fixtures() {
    }

    /** A file under src/test/resources/org/tufa/analysis/coverage. */
    static Path resource(String name) {
        try {
            return Path.of(Fixtures.class.getResource(name).toURI());
        } catch (URISyntaxException | NullPointerException e) {
            throw new IllegalStateException("test resource " + name + " missing", e);
        }
    }

    /**
     * The full Brick 1.4.4 file, ../shared/vocab/Brick.ttl relative to the repository root, when present. Tests run
     * in the module directory (analysis/), whose parent is the repository root.
     */
    static Optional<Path> fullBrick() {
        return shared("vocab/Brick.ttl");
    }

    /**
     * A published Brick example model in ../shared/brick-examples (third-party, see its README.md), when present.
     */
    static Optional<Path> brickExample(String name) {
        return shared("brick-examples/" + name);
    }

    private static Optional<Path> shared(String relative) {
        Path root = Path.of("").toAbsolutePath().getParent();
        Path file = root.resolve("../shared/" + relative).normalize();
        return Files.isRegularFile(file) ? Optional.of(file) : Optional.empty();
    }
}
