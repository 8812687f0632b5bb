ALTER TABLE `cart_lines` ADD `compressor_outlet_clock` text;--> statement-breakpoint
ALTER TABLE `cart_lines` ADD `turbine_inlet_clock` text;--> statement-breakpoint
ALTER TABLE `order_lines` ADD `compressor_outlet_clock` text;--> statement-breakpoint
ALTER TABLE `order_lines` ADD `turbine_inlet_clock` text;