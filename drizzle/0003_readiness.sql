CREATE TABLE `ops_heartbeats` (
	`instance` varchar(255) NOT NULL,
	`beat_at` timestamp(3) NOT NULL,
	CONSTRAINT `ops_heartbeats_instance` PRIMARY KEY(`instance`)
);
