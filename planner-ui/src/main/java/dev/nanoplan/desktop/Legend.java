package dev.nanoplan.desktop;

import dev.nanoplan.report.Palette;
import dev.nanoplan.scenario.Role;
import javafx.beans.binding.Bindings;
import javafx.beans.value.ObservableDoubleValue;
import javafx.geometry.Pos;
import javafx.scene.Node;
import javafx.scene.control.Label;
import javafx.scene.layout.BorderPane;
import javafx.scene.layout.HBox;
import javafx.scene.layout.Region;
import javafx.scene.layout.VBox;
import javafx.scene.paint.Color;
import javafx.scene.shape.Circle;
import javafx.scene.shape.Rectangle;

/** The 3D view's key: information colour scale (operating mutual information) (0 to the most a symbol carries), node roles, bottleneck. */
final class Legend {

    private Legend() {
    }

    static Region create(ObservableDoubleValue maxBits) {
        Label title = new Label("Link information (bit/symbol)");
        title.getStyleClass().add("legend-title");
        Rectangle bar = new Rectangle(200, 12);
        bar.setFill(CapacityColours.legendGradient());
        bar.setArcWidth(4);
        bar.setArcHeight(4);
        Label lo = new Label("0");
        Label mid = new Label();
        Label hi = new Label();
        mid.textProperty().bind(Bindings.createStringBinding(
                () -> Formats.tick(maxBits.get() / 2), maxBits));
        hi.textProperty().bind(Bindings.createStringBinding(
                () -> Formats.tick(maxBits.get()), maxBits));
        BorderPane ticks = new BorderPane();
        ticks.setLeft(lo);
        ticks.setCenter(mid);
        ticks.setRight(hi);
        ticks.setPrefWidth(200);
        ticks.setMaxWidth(200);
        HBox roles = new HBox(10);
        roles.setAlignment(Pos.CENTER_LEFT);
        for (Role r : Role.values()) {
            Circle c = new Circle(6, CapacityColours.role(r));
            Label l = new Label(r.id(), c);
            roles.getChildren().add(l);
        }
        Rectangle bn = new Rectangle(22, 5, Color.web(Palette.BOTTLENECK));
        Label bottleneck = new Label("bottleneck of the selected route", bn);
        VBox box = new VBox(4, title, bar, ticks, roles, bottleneck);
        box.getStyleClass().add("legend");
        box.setMaxSize(Region.USE_PREF_SIZE, Region.USE_PREF_SIZE);
        for (Node n : box.getChildren()) {
            n.getStyleClass().add("legend-text");
        }
        for (Node n : ticks.getChildren()) {
            n.getStyleClass().add("legend-text");
        }
        for (Node n : roles.getChildren()) {
            n.getStyleClass().add("legend-text");
        }
        return box;
    }

}
