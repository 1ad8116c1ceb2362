package dev.nanoplan.desktop;

import javafx.scene.control.Label;
import javafx.scene.layout.Region;
import javafx.scene.layout.VBox;

/** Charts of the selected link (filled in later). */
final class LinkChartsView {

    private final VBox box = new VBox(new Label("Select a link to see its charts."));

    LinkChartsView(PlannerViewModel vm) {
    }

    Region node() {
        return box;
    }
}
