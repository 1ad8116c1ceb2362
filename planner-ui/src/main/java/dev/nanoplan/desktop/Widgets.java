package dev.nanoplan.desktop;

import java.util.function.Function;
import javafx.beans.property.ReadOnlyObjectWrapper;
import javafx.beans.property.ReadOnlyStringWrapper;
import javafx.beans.property.StringProperty;
import javafx.beans.value.ObservableValue;
import javafx.scene.control.Button;
import javafx.scene.control.Label;
import javafx.scene.control.TableCell;
import javafx.scene.control.TableColumn;
import javafx.scene.control.TextField;
import javafx.scene.control.Tooltip;
import javafx.scene.layout.GridPane;

/**
 * Small controls the desktop panes share: buttons with tooltips, text fields bound to a property,
 * grids, section headings, and table columns of text or numbers (numbers shown through
 * {@link Formats}, sorted by value).
 */
final class Widgets {

    private Widgets() {
    }

    static Button button(String text, String tip, Runnable action) {
        Button b = new Button(text);
        b.setTooltip(new Tooltip(tip));
        b.setOnAction(e -> action.run());
        return b;
    }

    static TextField field(StringProperty p) {
        TextField f = new TextField();
        f.textProperty().bindBidirectional(p);
        f.setPrefColumnCount(8);
        return f;
    }

    static TextField smallField(StringProperty p, String prompt) {
        TextField f = field(p);
        f.setPrefColumnCount(4);
        f.setPromptText(prompt);
        return f;
    }

    static GridPane grid() {
        GridPane g = new GridPane();
        g.setHgap(6);
        g.setVgap(5);
        return g;
    }

    static Label section(String text) {
        Label l = new Label(text);
        l.getStyleClass().add("section");
        return l;
    }

    static <T> TableColumn<T, String> text(String name, Function<T, String> f) {
        TableColumn<T, String> c = new TableColumn<>(name);
        c.setCellValueFactory(cd -> new ReadOnlyStringWrapper(f.apply(cd.getValue())));
        return c;
    }

    static <T> TableColumn<T, Double> number(String name, Function<T, Double> f) {
        return numberText(name, f, t -> Formats.sig(f.apply(t)));
    }

    static <T> TableColumn<T, Double> numberText(String name, Function<T, Double> value, Function<T, String> shown) {
        TableColumn<T, Double> c = new TableColumn<>(name);
        c.setCellValueFactory(cd -> (ObservableValue<Double>) new ReadOnlyObjectWrapper<>(value.apply(cd.getValue())));
        c.setCellFactory(col -> new TableCell<>() {
            @Override
            protected void updateItem(Double item, boolean empty) {
                super.updateItem(item, empty);
                if (empty || getTableRow() == null || getTableRow().getItem() == null) {
                    setText(null);
                } else {
                    setText(shown.apply(getTableRow().getItem()));
                }
            }
        });
        c.setComparator((a, b) -> Double.compare(a == null ? Double.NaN : a, b == null ? Double.NaN : b));
        c.getStyleClass().add("number");
        return c;
    }
}
