package org.drumloop.plant;

import java.nio.file.Files;
import java.nio.file.Path;

/** Locates the project's plant files from the module directory (tests run in plant-sim/). */
final class PlantFiles {
    private PlantFiles() { }

    static Path path(String name) {
        Path p = Path.of("..", "config", "plants", name);
        if (!Files.exists(p)) {
            p = Path.of("config", "plants", name);
        }
        return p;
    }

    static PlantConfig ab160() throws PlantConfigException {
        return PlantFile.load(path("ab160.plant"));
    }

    static PlantConfig aux() throws PlantConfigException {
        return PlantFile.load(path("aux-boiler.plant"));
    }
}
