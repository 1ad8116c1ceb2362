package dev.nanoplan.desktop;

import java.util.function.Function;
import javafx.beans.binding.Bindings;
import javafx.beans.value.ObservableStringValue;
import javafx.beans.property.ReadOnlyObjectWrapper;
import javafx.collections.ListChangeListener;
import javafx.beans.property.ReadOnlyStringWrapper;
import javafx.beans.property.StringProperty;
import javafx.beans.value.ObservableValue;
import javafx.geometry.Insets;
import javafx.scene.control.Button;
import javafx.scene.control.Control;
import javafx.scene.control.Label;
import javafx.scene.control.ScrollPane;
import javafx.scene.control.TableCell;
import javafx.scene.control.TableColumn;
import javafx.scene.control.TableView;
import javafx.scene.control.TextField;
import javafx.scene.control.Tooltip;
import javafx.scene.layout.GridPane;
import javafx.scene.layout.VBox;
import javafx.scene.text.Text;

/**
 * Small controls the desktop panes share: buttons with tooltips, text fields bound to a property,
 * grids, section headings, and table columns of text or numbers (numbers shown through
 * {@link Formats}, sorted by value).
 */
final class Widgets {

    /** Style class of a field whose value was refused (nanoplan.css outlines it). */
    static final String FIELD_ERROR = "field-error";
    /** Column property holding the function that gives a row's shown text (for fitting widths). */
    private static final String SHOWN = "nanoplan.shownText";
    /** Room for a cell's padding and a header's sort arrow, in pixels. */
    private static final double COLUMN_PADDING_PX = 26;

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

    /** A field bound to {@code p} with the node id {@code id} (found by window tests). */
    static TextField field(StringProperty p, String id) {
        TextField f = field(p);
        f.setId(id);
        return f;
    }

    static TextField smallField(StringProperty p, String prompt) {
        TextField f = field(p);
        f.setPrefColumnCount(4);
        f.setPromptText(prompt);
        return f;
    }

    /**
     * Outlines {@code field} (style class {@code field-error}) while {@code error} is not empty, and
     * shows the message as its tooltip.
     */
    static void outline(Control field, ObservableStringValue error) {
        Runnable mark = () -> {
            String m = error.get();
            field.getStyleClass().remove(FIELD_ERROR);
            if (m != null && !m.isEmpty()) {
                field.getStyleClass().add(FIELD_ERROR);
            }
        };
        error.addListener((o, a, b) -> mark.run());
        mark.run();
    }

    /** A wrapped label showing {@code error}, hidden (and taking no room) while it is empty. */
    static Label errorLabel(ObservableStringValue error) {
        Label l = new Label();
        l.textProperty().bind(error);
        l.getStyleClass().add("field-error-text");
        l.setWrapText(true);
        l.setMinWidth(0);
        l.setPrefWidth(1);
        l.setMaxWidth(Double.MAX_VALUE);
        l.visibleProperty().bind(Bindings.isNotEmpty(error));
        l.managedProperty().bind(l.visibleProperty());
        return l;
    }

    /**
     * Adds {@code label} and {@code field} at {@code row} of {@code g}, outlined while {@code error}
     * holds a message, and the message under them across both columns; returns the next free row.
     */
    static int fieldRow(GridPane g, int row, Label label, Control field, ObservableStringValue error) {
        g.addRow(row, label, field);
        outline(field, error);
        g.add(errorLabel(error), 0, row + 1, 2, 1);
        return row + 2;
    }

    static GridPane grid() {
        GridPane g = new GridPane();
        g.setHgap(6);
        g.setVgap(5);
        return g;
    }

    /**
     * A tab's content: {@code box} padded and styled as a panel, scrolling when taller than the tab,
     * with {@code owner} (its view) as user data for tests.
     */
    static ScrollPane scrollingPanel(VBox box, Object owner) {
        box.setPadding(new Insets(10));
        box.getStyleClass().add("inspector");
        ScrollPane root = new ScrollPane(box);
        root.setFitToWidth(true);
        root.getStyleClass().add("inspector");
        root.setUserData(owner);
        return root;
    }

    static Label section(String text) {
        Label l = new Label(text);
        l.getStyleClass().add("section");
        return l;
    }

    static <T> TableColumn<T, String> text(String name, Function<T, String> f) {
        TableColumn<T, String> c = new TableColumn<>(name);
        c.setCellValueFactory(cd -> new ReadOnlyStringWrapper(f.apply(cd.getValue())));
        c.getProperties().put(SHOWN, f);
        return c;
    }

    static <T> TableColumn<T, Double> number(String name, Function<T, Double> f) {
        return numberText(name, f, t -> Formats.sig(f.apply(t)));
    }

    static <T> TableColumn<T, Double> numberText(String name, Function<T, Double> value, Function<T, String> shown) {
        return cell(name, value, t -> TableText.Cell.of(shown.apply(t)));
    }

    /**
     * A number column sorted by {@code value} and showing {@code shown}: its text, and its tooltip
     * (why a value is not applicable) when there is one.
     */
    static <T> TableColumn<T, Double> cell(String name, Function<T, Double> value, Function<T, TableText.Cell> shown) {
        TableColumn<T, Double> c = new TableColumn<>(name);
        c.getProperties().put(SHOWN, (Function<T, String>) t -> shown.apply(t).text());
        c.setCellValueFactory(cd -> (ObservableValue<Double>) new ReadOnlyObjectWrapper<>(value.apply(cd.getValue())));
        c.setCellFactory(col -> new TableCell<>() {
            @Override
            protected void updateItem(Double item, boolean empty) {
                super.updateItem(item, empty);
                if (empty || getTableRow() == null || getTableRow().getItem() == null) {
                    setText(null);
                    setTooltip(null);
                } else {
                    TableText.Cell cell = shown.apply(getTableRow().getItem());
                    setText(cell.text());
                    setTooltip(cell.tooltip() == null ? null : new Tooltip(cell.tooltip()));
                }
            }
        });
        c.setComparator((a, b) -> Double.compare(a == null ? Double.NaN : a, b == null ? Double.NaN : b));
        c.getStyleClass().add("number");
        return c;
    }

    /**
     * Sizes every column of {@code table} to its header and its widest shown text, now and whenever
     * the rows change, so no header or value is clipped at any window size (the table scrolls
     * sideways instead).
     */
    static <T> void fitColumns(TableView<T> table) {
        Runnable fit = () -> {
            for (TableColumn<T, ?> c : table.getColumns()) {
                @SuppressWarnings("unchecked")
                Function<T, String> shown = (Function<T, String>) c.getProperties().get(SHOWN);
                double w = textWidth(c.getText()) * 1.1;
                if (shown != null) {
                    for (T row : table.getItems()) {
                        w = Math.max(w, textWidth(shown.apply(row)));
                    }
                }
                c.setPrefWidth(Math.ceil(w + COLUMN_PADDING_PX));
            }
        };
        table.getItems().addListener((ListChangeListener<T>) ch -> fit.run());
        table.itemsProperty().addListener((o, a, b) -> fit.run());
        fit.run();
    }

    private static double textWidth(String s) {
        return s == null || s.isEmpty() ? 0 : new Text(s).getLayoutBounds().getWidth();
    }
}
